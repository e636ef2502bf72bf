/**
 * build --shard K/N and merge, through the binary: the demo catalog built in
 * three slices (a stable assignment by slug) and joined gives a site byte for
 * byte identical to one build of the whole (every file's SHA-256, the
 * manifest included); slices that do not make one split are refused.
 */
import { spawnSync } from 'node:child_process';
import { mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import { shardOf } from '../../src/pipeline/build-catalog.js';
import { snapshot } from '../support/snapshot.js';

const ROOT = join(import.meta.dirname, '../..');
const BIN = join(ROOT, 'bin/scatterbook.js');
let dir: string;
const run = (args: string[]) => spawnSync(process.execPath, [BIN, ...args], { cwd: dir, encoding: 'utf8' });

beforeAll(() => {
  dir = mkdtempSync(join(tmpdir(), 'scatterbook-shard-'));
});

describe('build --shard K/N and merge', () => {
  it('three slices joined equal one whole build, byte for byte', () => {
    const content = join(ROOT, 'content');
    for (const k of [1, 2, 3]) {
      const r = run(['build', content, '--out', `slice${k}`, '--no-pdf', '--no-cache', '--shard', `${k}/3`]);
      expect(r.status, r.stderr).toBe(0);
      expect(r.stdout).toMatch(new RegExp(`^built slice ${k}/3: `));
    }
    const m = run(['merge', 'slice1', 'slice2', 'slice3', '--out', 'joined']);
    expect(m.stderr).toBe('');
    expect(m.status).toBe(0);
    expect(m.stdout).toBe('joined 3 slices: 8 parts and 1 comparison into joined/\n');
    expect(run(['build', content, '--out', 'whole', '--no-pdf', '--no-cache']).status).toBe(0);
    const whole = snapshot(join(dir, 'whole')),
      joined = snapshot(join(dir, 'joined'));
    expect(Object.keys(joined).sort()).toEqual(Object.keys(whole).sort());
    expect(joined).toEqual(whole);
    // and the joined site holds as its manifest says
    expect(run(['verify', 'joined', content]).status).toBe(0);
  }, 180_000);

  it('the assignment is stable and spreads the parts', () => {
    const slugs = ['vt-amp-0560', 'vt-bpf-2450', 'vt-cbl-150', 'vt-dc20-2000', 'vt-hyb90-2450', 'vt-iso-3000', 'vt-pad-10', 'vt-pd2-2000'];
    expect(slugs.map((s) => shardOf(s, 3))).toEqual(slugs.map((s) => shardOf(s, 3)));
    expect(new Set(slugs.map((s) => shardOf(s, 3))).size).toBe(3);
    expect(shardOf('any', 1)).toBe(0);
  });

  it('slices that do not make one split, and a bad --shard: one message each, nothing written', () => {
    expect(run(['merge', 'slice1', 'slice3', '--out', 'partial']).stderr).toBe('error: the slices of 3 are 1, 3: slice 2 missing\n');
    expect(run(['merge', 'slice1', 'slice1', 'slice2', 'slice3', '--out', 'partial']).stderr).toBe(
      'error: the slices of 3 are 1, 1, 2, 3: slice 1 given twice\n',
    );
    expect(run(['merge', 'whole', '--out', 'partial']).stderr).toBe('error: whole: not the output of build --shard K/N (no .scatterbook-shard.json)\n');
    const bad = run(['build', join(ROOT, 'content'), '--out', 'x', '--shard', '4/3']);
    expect(bad.status).toBe(2);
    expect(bad.stderr).toContain('--shard 4/3: expected K/N with 1 ≤ K ≤ N, e.g. --shard 2/4');
    expect(spawnSync('ls', [join(dir, 'partial')]).status).not.toBe(0);
  });
});
