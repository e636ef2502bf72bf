/**
 * Publishing a built folder in place of the old one: the new site is built
 * beside the target, then the old target is moved aside and the new one
 * renamed into its place, so a reader sees the old site or the new one,
 * never a half-built one; the old one is removed last.
 */
import { existsSync, mkdirSync, renameSync, rmSync } from 'node:fs';
import { basename, dirname, join, resolve } from 'node:path';

/** A fresh temporary folder beside `target` (same file system, so rename is atomic). */
export function stagingFolder(target: string): string {
  const abs = resolve(target);
  mkdirSync(dirname(abs), { recursive: true });
  const dir = join(dirname(abs), `.${basename(abs)}.building-${process.pid}-${Date.now()}`);
  mkdirSync(dir);
  return dir;
}

export function swapInto(staging: string, target: string): void {
  const abs = resolve(target);
  const old = `${join(dirname(abs), `.${basename(abs)}.old-${process.pid}-${Date.now()}`)}`;
  const hadOld = existsSync(abs);
  if (hadOld) renameSync(abs, old);
  try {
    renameSync(staging, abs);
  } catch (e) {
    if (hadOld) renameSync(old, abs);
    throw e;
  }
  if (hadOld) rmSync(old, { recursive: true, force: true });
}

export function discard(staging: string): void {
  rmSync(staging, { recursive: true, force: true });
}
