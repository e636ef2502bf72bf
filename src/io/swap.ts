/**
 * Publishing a built folder in place of the old one. The new site is built in
 * a staging folder on the same file system, then swapped in by renames, so a
 * reader sees the old site or the new one, never a half-built one; the old one
 * is removed last.
 *
 * Two ways to swap:
 * - `folder`: the staging folder sits beside the target; the old target is
 *   renamed aside and the staging folder renamed into its place.
 * - `contents`: the target is a mount point (a container volume, say), which
 *   cannot be renamed; the staging folder sits inside it, and the entries are
 *   swapped one by one instead.
 *
 * Staging and old folders carry the builder's process id in their names, so a
 * later build removes those that builds killed before they finished left behind.
 */
import { existsSync, lstatSync, mkdirSync, readdirSync, renameSync, rmSync, statSync } from 'node:fs';
import { basename, dirname, join } from 'node:path';
import { realPath } from './output-folder.js';

export interface Staging {
  /** The folder to build into. */
  readonly dir: string;
  /** The (real) target it will replace. */
  readonly target: string;
  readonly mode: 'folder' | 'contents';
}

const CONTENTS_PREFIX = '.scatterbook-';
const stamp = () => `${process.pid}-${Date.now()}-${Math.random().toString(36).slice(2, 8)}`;

/** Whether `dir` is a mount point: its device differs from its parent's. */
export function isMountPoint(dir: string): boolean {
  try {
    const st = statSync(dir);
    return st.isDirectory() && st.dev !== statSync(dirname(dir)).dev;
  } catch {
    return false;
  }
}

function alive(pid: number): boolean {
  if (pid === process.pid) return true;
  try {
    process.kill(pid, 0);
    return true;
  } catch (e) {
    return (e as NodeJS.ErrnoException).code === 'EPERM';
  }
}

/** Removes staging and old folders in `dir` whose names match and whose builder is no longer running. */
function removeLeftovers(dir: string, pattern: RegExp): string[] {
  const removed: string[] = [];
  let names: string[];
  try {
    names = readdirSync(dir);
  } catch {
    return removed;
  }
  for (const name of names) {
    const m = pattern.exec(name);
    if (!m || alive(Number(m[1]))) continue;
    try {
      if (lstatSync(join(dir, name)).isDirectory()) {
        rmSync(join(dir, name), { recursive: true, force: true });
        removed.push(join(dir, name));
      }
    } catch {
      // another build removed it first
    }
  }
  return removed;
}

const escapeRe = (s: string) => s.replace(/[.*+?^${}()|[\]\\]/g, '\\$&');

/**
 * Staging and old folders of the target left by builds that were killed;
 * removes them and says which. A build killed in the middle of its swap is
 * undone first, so the previous site comes back whole: beside the target, a
 * dead old folder with no target is renamed back; inside a mount point, the
 * entries already placed are removed and the old entries moved back.
 */
export function removeDeadBuilds(target: string): string[] {
  const abs = realPath(target);
  const beside = new RegExp(`^\\.${escapeRe(basename(abs))}\\.(?:building|old|pages)-(\\d+)-`);
  const inside = new RegExp(`^${escapeRe(CONTENTS_PREFIX)}(?:building|old)-(\\d+)-`);
  restoreInterruptedSwap(abs);
  return [...removeLeftovers(dirname(abs), beside), ...removeLeftovers(abs, inside)];
}

function restoreInterruptedSwap(abs: string): void {
  const dead = (dir: string, re: RegExp) => {
    try {
      return readdirSync(dir)
        .filter((n) => {
          const m = re.exec(n);
          return m !== null && !alive(Number(m[1]));
        })
        .sort();
    } catch {
      return [];
    }
  };
  if (!existsSync(abs)) {
    const olds = dead(dirname(abs), new RegExp(`^\\.${escapeRe(basename(abs))}\\.old-(\\d+)-`));
    if (olds.length) renameSync(join(dirname(abs), olds[olds.length - 1]), abs);
    return;
  }
  for (const o of dead(abs, new RegExp(`^${escapeRe(CONTENTS_PREFIX)}old-(\\d+)-`))) {
    const old = join(abs, o);
    const saved = readdirSync(old);
    if (!saved.length) continue;
    // every previous entry was moved into old before any new one was placed: whatever else is here is new
    for (const n of readdirSync(abs)) if (!n.startsWith(CONTENTS_PREFIX)) rmSync(join(abs, n), { recursive: true, force: true });
    for (const n of saved) renameSync(join(old, n), join(abs, n));
  }
}

/** A fresh folder beside the target for what a build keeps out of memory until it writes its pages (removed by the build, or, if it was killed, by the next). */
export function pagesFolder(target: string): string {
  const abs = realPath(target);
  mkdirSync(dirname(abs), { recursive: true });
  const dir = join(dirname(abs), `.${basename(abs)}.pages-${stamp()}`);
  mkdirSync(dir);
  return dir;
}

/** A fresh staging folder for `target` on the target's file system. */
export function stagingFolder(target: string, mode: 'auto' | 'folder' | 'contents' = 'auto'): Staging {
  const abs = realPath(target);
  const m = mode === 'auto' ? (isMountPoint(abs) ? 'contents' : 'folder') : mode;
  if (m === 'contents') {
    mkdirSync(abs, { recursive: true });
    const dir = join(abs, `${CONTENTS_PREFIX}building-${stamp()}`);
    mkdirSync(dir);
    return { dir, target: abs, mode: m };
  }
  mkdirSync(dirname(abs), { recursive: true });
  const dir = join(dirname(abs), `.${basename(abs)}.building-${stamp()}`);
  mkdirSync(dir);
  return { dir, target: abs, mode: m };
}

export function swapInto(staging: Staging): void {
  if (staging.mode === 'contents') return swapContents(staging);
  const abs = staging.target;
  const old = join(dirname(abs), `.${basename(abs)}.old-${stamp()}`);
  let hadOld = true;
  try {
    renameSync(abs, old);
  } catch (e) {
    if ((e as NodeJS.ErrnoException).code !== 'ENOENT') throw e;
    hadOld = false;
  }
  try {
    renameSync(staging.dir, abs);
  } catch (e) {
    if (hadOld) renameSync(old, abs);
    throw e;
  }
  if (hadOld) rmSync(old, { recursive: true, force: true });
}

/** The target cannot be renamed: move its entries into an old folder inside it, then the staged entries into it. */
function swapContents(staging: Staging): void {
  const abs = staging.target;
  const old = join(abs, `${CONTENTS_PREFIX}old-${stamp()}`);
  mkdirSync(old);
  const ownName = (n: string) => n === basename(staging.dir) || n === basename(old);
  const previous = readdirSync(abs).filter((n) => !ownName(n) && !/^\.scatterbook-(building|old)-/.test(n));
  const moved: string[] = [];
  const placed: string[] = [];
  try {
    for (const n of previous) {
      renameSync(join(abs, n), join(old, n));
      moved.push(n);
    }
    for (const n of readdirSync(staging.dir)) {
      renameSync(join(staging.dir, n), join(abs, n));
      placed.push(n);
    }
  } catch (e) {
    // put everything back as it was
    for (const n of placed) renameSync(join(abs, n), join(staging.dir, n));
    for (const n of moved) renameSync(join(old, n), join(abs, n));
    rmSync(old, { recursive: true, force: true });
    throw e;
  }
  rmSync(staging.dir, { recursive: true, force: true });
  rmSync(old, { recursive: true, force: true });
}

export function discard(staging: Staging): void {
  rmSync(staging.dir, { recursive: true, force: true });
}
