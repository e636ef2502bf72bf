/**
 * `scatterbook compare`, the quick form, through the binary: one filter unit
 * of the demo and copies made from it by the network math (not by hand-typed
 * numbers): 0.5 dB more loss in S21 and S12 (its insertion-loss worst is
 * exactly 0.5 dB higher and it ranks lower: the definition IL = −20·log10|S21|),
 * the same unit renormalized to 75 Ω and written with R 75 (back at 50 Ω its
 * figures equal the original's to 1e-9: power-wave renormalization is
 * invertible), and one cut short of the band (partial coverage: no rank, no pass).
 */
import { spawnSync } from 'node:child_process';
import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import { renormalize } from '../../src/network/convert.js';
import { makeNetwork } from '../../src/network/network.js';
import { readTouchstone } from '../../src/touchstone/read.js';
import { writeTouchstone } from '../../src/touchstone/write.js';

const ROOT = join(import.meta.dirname, '../..');
const BIN = join(ROOT, 'bin/scatterbook.js');
let dir: string;

function run(args: string[]) {
  const r = spawnSync(process.execPath, [BIN, ...args], { cwd: dir, encoding: 'utf8' });
  return { status: r.status, stdout: r.stdout, stderr: r.stderr };
}

beforeAll(() => {
  dir = mkdtempSync(join(tmpdir(), 'scatterbook-compare-'));
  const net = (readTouchstone(readFileSync(join(ROOT, 'content/parts/vt-bpf-2450/data/sn1001.s2p')), { fileName: 'sn1001.s2p' }).value as NonNullable<ReturnType<typeof readTouchstone>['value']>).network;
  writeFileSync(join(dir, 'ours.s2p'), writeTouchstone(net, { format: 'RI' }));
  // 0.5 dB more loss in both directions of transmission
  const s = Float64Array.from(net.s);
  const a = Math.pow(10, -0.5 / 20);
  for (let k = 0; k < net.freqHz.length; k++) for (const e of [2, 1]) for (const c of [0, 1]) s[2 * (k * 4 + e) + c] *= a; // S21 (row 2, col 1) and S12
  writeFileSync(join(dir, 'lossier.s2p'), writeTouchstone(makeNetwork(net.freqHz, net.z0, s, 2), { format: 'RI' }));
  writeFileSync(join(dir, 'at75.s2p'), writeTouchstone(renormalize(net, 75), { format: 'RI' }));
  const cut = net.freqHz.findIndex((f) => f > 2.45e9);
  writeFileSync(join(dir, 'short.s2p'), writeTouchstone(makeNetwork(net.freqHz.slice(0, cut), net.z0, net.s.slice(0, cut * 8), 2), { format: 'RI' }));
});

const LIMITS = ['--band', '2.40GHz..2.48GHz', '--limit', 'insertion-loss S21 max 1.9 dB', '--limit', 'return-loss S11+S22 min 15 dB'];

describe('scatterbook compare (quick form)', () => {
  it('--json prints exactly the documented shape, candidates in input order', () => {
    const r = run(['compare', 'ours.s2p', 'lossier.s2p', ...LIMITS, '--json']);
    expect(r.stderr).toBe('');
    expect(r.status).toBe(0);
    const j = JSON.parse(r.stdout);
    expect(Object.keys(j)).toEqual(['title', 'reference', 'candidates']);
    expect(j.reference).toBe(50);
    expect(j.candidates.map((c: { label: string }) => c.label)).toEqual(['ours.s2p', 'lossier.s2p']);
    expect(Object.keys(j.candidates[0])).toEqual(['label', 'rank', 'pass', 'coverage', 'results']);
    expect(Object.keys(j.candidates[0].results[0])).toEqual(['figure', 'on', 'band', 'fromHz', 'toHz', 'unit', 'limit', 'worst', 'worstAtHz', 'worstUnit', 'worstOn', 'typical', 'typicalUnit', 'margin', 'pass', 'units']);
  });

  it('0.5 dB more loss: the insertion-loss worst is 0.5 dB higher, at the same frequency, and it ranks lower', () => {
    const j = JSON.parse(run(['compare', 'lossier.s2p', 'ours.s2p', ...LIMITS, '--json']).stdout);
    const [lossier, ours] = j.candidates;
    expect(Math.abs(lossier.results[0].worst - ours.results[0].worst - 0.5)).toBeLessThan(1e-9);
    expect(lossier.results[0].worstAtHz).toBe(ours.results[0].worstAtHz);
    expect([ours.rank, lossier.rank]).toEqual([1, 2]);
    expect(ours.coverage).toBe('full');
  });

  it('a file measured at 75 Ω, renormalized back to the comparison\'s 50 Ω, gives the original figures to 1e-9', () => {
    const j = JSON.parse(run(['compare', 'ours.s2p', 'at75.s2p', ...LIMITS, '--json']).stdout);
    const [a, b] = j.candidates;
    a.results.forEach((r: { worst: number; typical: number }, i: number) => {
      expect(Math.abs(b.results[i].worst - r.worst)).toBeLessThan(1e-9);
      expect(Math.abs(b.results[i].typical - r.typical)).toBeLessThan(1e-9);
    });
    // at its own 75 Ω the same data read very differently: the renormalization is what makes them comparable
    const raw = JSON.parse(run(['compare', 'at75.s2p', ...LIMITS, '--reference', '75', '--json']).stdout);
    expect(Math.abs(raw.candidates[0].results[1].worst - a.results[1].worst)).toBeGreaterThan(1);
  });

  it('a candidate cut short of the band: partial coverage, no rank, no pass, and the table says where data are missing', () => {
    const r = run(['compare', 'ours.s2p', 'short.s2p', ...LIMITS, '--json']);
    const [, short] = JSON.parse(r.stdout).candidates;
    expect(short).toMatchObject({ coverage: 'partial', rank: null, pass: false });
    const t = run(['compare', 'ours.s2p', 'short.s2p', ...LIMITS]);
    expect(t.stdout).toMatch(/short\.s2p: no data over 2\.4 GHz to 2\.48 GHz beyond 2\.4 GHz to 2\.4[\d.]* GHz/);
    expect(t.stdout).toMatch(/rank\s+1\s+— \(partial data\)/);
    expect(run(['compare', 'ours.s2p', 'short.s2p', ...LIMITS, '--strict']).status).toBe(3);
  });

  it('bad input: one positioned message per mistake, exit 1; bad usage exit 2', () => {
    const r = run(['compare', 'ours.s2p', '--band', '2.40GHz..2.48GHz', '--limit', 'insertion-los S21 max 1 dB']);
    expect(r.status).toBe(1);
    expect(r.stderr).toBe('error: --limit "insertion-los S21 max 1 dB": unknown figure "insertion-los"; did you mean "insertion-loss"?\n');
    expect(run(['compare', 'ours.s2p', '--band', '2.40..2.48GHz', '--limit', 'insertion-loss S21 max 1 dB']).status).toBe(1);
    expect(run(['compare', 'ours.s2p']).status).toBe(2);
    expect(run(['compare', 'nope.s2p', ...LIMITS]).stderr).toContain('nope.s2p: cannot read the file');
  });
});
