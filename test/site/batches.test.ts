/**
 * A large catalog's pages are written in several Eleventy runs (Eleventy
 * keeps every page of a run in memory until the run ends), through the
 * binary: the demo written in runs of three parts (SCATTERBOOK_PAGE_BATCH=3)
 * is byte for byte the site written in one run.
 */
import { spawnSync } from 'node:child_process';
import { mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { snapshot } from '../support/snapshot.js';

const ROOT = join(import.meta.dirname, '../..');
const BIN = join(ROOT, 'bin/scatterbook.js');

describe('pages written in batches', () => {
  it('runs of three parts give the same site as one run', () => {
    const dir = mkdtempSync(join(tmpdir(), 'scatterbook-batches-'));
    const build = (out: string, env: Record<string, string> = {}) =>
      spawnSync(process.execPath, [BIN, 'build', join(ROOT, 'content'), '--out', out, '--no-pdf', '--no-cache'], {
        cwd: dir,
        encoding: 'utf8',
        env: { ...process.env, ...env },
      });
    expect(build('one').status).toBe(0);
    expect(build('runs', { SCATTERBOOK_PAGE_BATCH: '3' }).status).toBe(0);
    const one = snapshot(join(dir, 'one'));
    expect(Object.keys(one).length).toBeGreaterThan(40);
    expect(snapshot(join(dir, 'runs'))).toEqual(one);
  }, 120_000);
});
