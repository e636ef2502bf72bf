/**
 * `scatterbook compare`, the quick form, through the binary: one filter unit
 * of the demo and copies made from it by the network math (not by hand-typed
 * numbers): 0.5 dB more loss in S21 and S12 (its insertion-loss worst is
 * exactly 0.5 dB higher and it ranks lower: the definition IL = −20·log10|S21|),
 * the same unit renormalized to 75 Ω and written with R 75 (back at 50 Ω its
 * figures equal the original's to 1e-9: power-wave renormalization is
 * invertible), and one cut short of the band (partial coverage: no rank, no pass);
 * then the same four as a comparison file in a content folder, and what a
 * comparison file can get wrong.
 */
import { spawnSync } from 'node:child_process';
import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { cpSync, existsSync, mkdirSync, rmSync } from 'node:fs';
import { beforeAll, describe, expect, it } from 'vitest';
import { evaluateComparisonFile } from '../../src/pipeline/comparison.js';
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
  const net = (
    readTouchstone(readFileSync(join(ROOT, 'content/parts/vt-bpf-2450/data/sn1001.s2p')), { fileName: 'sn1001.s2p' }).value as NonNullable<
      ReturnType<typeof readTouchstone>['value']
    >
  ).network;
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
    expect(Object.keys(j.candidates[0].results[0])).toEqual([
      'figure',
      'on',
      'band',
      'fromHz',
      'toHz',
      'unit',
      'limit',
      'worst',
      'worstAtHz',
      'worstUnit',
      'worstOn',
      'typical',
      'typicalUnit',
      'margin',
      'pass',
      'units',
    ]);
  });

  it('0.5 dB more loss: the insertion-loss worst is 0.5 dB higher, at the same frequency, and it ranks lower', () => {
    const j = JSON.parse(run(['compare', 'lossier.s2p', 'ours.s2p', ...LIMITS, '--json']).stdout);
    const [lossier, ours] = j.candidates;
    expect(Math.abs(lossier.results[0].worst - ours.results[0].worst - 0.5)).toBeLessThan(1e-9);
    expect(lossier.results[0].worstAtHz).toBe(ours.results[0].worstAtHz);
    expect([ours.rank, lossier.rank]).toEqual([1, 2]);
    expect(ours.coverage).toBe('full');
  });

  it("a file measured at 75 Ω, renormalized back to the comparison's 50 Ω, gives the original figures to 1e-9", () => {
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
    expect(t.stdout).toMatch(/short\.s2p: data cover 2\.4 GHz to 2\.4[\d.]* GHz of use \(2\.4 GHz to 2\.48 GHz\) only/);
    expect(t.stdout).toMatch(/rank\s+1\s+— \(partial data\)/);
    expect(run(['compare', 'ours.s2p', 'short.s2p', ...LIMITS, '--strict']).status).toBe(3);
  });

  it('bad input: one positioned message per mistake, exit 1; bad usage exit 2', () => {
    const r = run(['compare', 'ours.s2p', '--band', '2.40GHz..2.48GHz', '--limit', 'insertion-los S21 max 1 dB']);
    expect(r.status).toBe(1);
    expect(r.stderr).toBe('error: --limit "insertion-los S21 max 1 dB": unknown figure "insertion-los"; did you mean "insertion-loss"?\n');
    expect(run(['compare', 'ours.s2p', '--band', '2.40..2.48GHz', '--limit', 'insertion-loss S21 max 1 dB']).status).toBe(1);
    expect(run(['compare', 'ours.s2p']).status).toBe(2);
    expect(run(['compare', 'nope.s2p', ...LIMITS]).stderr).toContain('nope.s2p: error: cannot read the file');
  });
});

const COMPARISON = `title: Copies of one filter
bands: {use: {from: 2.40 GHz, to: 2.48 GHz}}
limits:
  - {figure: insertion-loss, on: S21, band: use, max: 1.9 dB}
  - {figure: return-loss, on: [S11, S22], band: use, min: 15 dB}
candidates:
  - {label: Ours, part: ../parts/f/part.yaml}
  - {label: Lossier, file: data/lossier.s2p, ports: {1: 1, 2: 2}}
  - {label: At 75 ohm, file: data/at75.s2p}
  - {label: Short, files: [data/short.s2p]}
baseline: Ours
`;

describe('scatterbook compare COMPARISON.yaml', () => {
  let content: string;
  const file = () => join(content, 'comparisons', 'copies.yaml');
  const write = (text: string) => writeFileSync(file(), text);
  beforeAll(() => {
    content = join(dir, 'content');
    mkdirSync(join(content, 'parts/f/data'), { recursive: true });
    mkdirSync(join(content, 'comparisons/data'), { recursive: true });
    writeFileSync(join(content, 'parts/f/part.yaml'), 'part: F-1\nclass: filter\nmeasurements:\n  - {unit: U1, file: data/ours.s2p}\n');
    cpSync(join(dir, 'ours.s2p'), join(content, 'parts/f/data/ours.s2p'));
    for (const f of ['lossier', 'at75', 'short']) cpSync(join(dir, `${f}.s2p`), join(content, 'comparisons/data', `${f}.s2p`));
  });

  it('--json: the documented shape; 0.5 dB more loss ranks lower by exactly 0.5 dB; 75 Ω back at 50 Ω equals the original to 1e-9; the short one partial', () => {
    write(COMPARISON);
    const r = run(['compare', file(), '--json']);
    expect(r.stderr).toBe('');
    expect(r.status).toBe(0);
    const j = JSON.parse(r.stdout);
    expect(Object.keys(j)).toEqual(['title', 'reference', 'candidates']);
    expect(j).toMatchObject({ title: 'Copies of one filter', reference: 50 });
    const [ours, lossier, at75, short] = j.candidates;
    expect(j.candidates.map((c: { label: string }) => c.label)).toEqual(['Ours', 'Lossier', 'At 75 ohm', 'Short']);
    expect(Math.abs(lossier.results[0].worst - ours.results[0].worst - 0.5)).toBeLessThan(1e-9);
    ours.results.forEach((x: { worst: number }, i: number) => expect(Math.abs(at75.results[i].worst - x.worst)).toBeLessThan(1e-9));
    expect(short).toMatchObject({ coverage: 'partial', rank: null, pass: false });
    expect(lossier.rank).toBeGreaterThan(ours.rank);
    const text = run(['compare', file()]).stdout;
    expect(text).toContain('Lossier: Insertion loss S21 over use: +0.50 dB');
    expect(text).toMatch(/Lossier: 0\.50 dB less margin than (Ours|At 75 ohm) on insertion loss S21 over use/);
  });

  it('the difference trace of the lossier copy against the baseline is 0.5 dB flat, on every point of the band and its edges (IL = −20·log10|S21|)', async () => {
    write(COMPARISON);
    const o = await evaluateComparisonFile(file(), content);
    expect(o.errors).toEqual([]);
    const d = o.differences?.find((x) => x.label === 'Lossier');
    const il = d?.traces.find((t) => t.figure === 'insertion-loss');
    expect(il?.trace.freqHz[0]).toBe(2.4e9);
    expect(il?.trace.freqHz.at(-1)).toBe(2.48e9);
    for (const v of il?.trace.values ?? []) expect(Math.abs(v - 0.5)).toBeLessThan(1e-9);
    // its return loss is the same as the baseline's
    for (const t of d?.traces.filter((x) => x.figure === 'return-loss') ?? []) for (const v of t.trace.values) expect(Math.abs(v)).toBeLessThan(1e-9);
  });

  const bad: Array<[string, (t: string) => string, RegExp]> = [
    [
      'a port map naming a port the file lacks',
      (t) => t.replace('ports: {1: 1, 2: 2}', 'ports: {1: 3, 2: 2}'),
      /copies\.yaml:8:\d+: error: the port map of "Lossier" names port 3 of the file, but data\/lossier\.s2p has 2 ports/,
    ],
    [
      'a part path that is no part file',
      (t) => t.replace('part: ../parts/f/part.yaml', 'part: data/lossier.s2p'),
      /copies\.yaml:7:\d+: error: part "data\/lossier\.s2p" of candidate "Ours" is no part file/,
    ],
    [
      'a file outside the content folder',
      (t) => t.replace('file: data/at75.s2p', 'file: ../../at75.s2p'),
      /copies\.yaml:9:\d+: error: file "\.\.\/\.\.\/at75\.s2p" of candidate "At 75 ohm" lies outside the content folder/,
    ],
    [
      'a band no candidate covers at all',
      (t) =>
        t
          .replace('bands: {use: {from: 2.40 GHz, to: 2.48 GHz}}', 'bands: {use: {from: 2.40 GHz, to: 2.48 GHz}, far: {from: 40 GHz, to: 41 GHz}}')
          .replace('band: use, min: 15 dB', 'band: far, min: 15 dB'),
      /copies\.yaml:2:\d+: error: no candidate has any data in band far/,
    ],
    [
      "parameters the candidates' ports cannot line up with",
      (t) => t.replace('on: S21, band: use', 'on: S31, band: use'),
      /copies\.yaml:4:\d+: error: candidates "Ours", "Lossier", "At 75 ohm": S31 needs port 3, but the measured files have 2 ports/,
    ],
    ['a label used twice', (t) => t.replace('label: Short', 'label: Ours'), /copies\.yaml:10:\d+: error: the label "Ours" is used twice/],
    [
      'a baseline that is no candidate',
      (t) => t.replace('baseline: Ours', 'baseline: Theirs'),
      /copies\.yaml:11:11: error: baseline "Theirs" is not the label of a candidate/,
    ],
  ];
  it.each(bad)('%s: one positioned message with the source line, exit 1', (_, change, message) => {
    write(change(COMPARISON));
    const r = run(['compare', file()]);
    expect(r.status).toBe(1);
    expect(r.stdout).toBe('');
    expect(r.stderr).toMatch(message);
    expect(r.stderr.split('\n').filter((l) => l.includes(': error:')).length, r.stderr).toBe(1);
  });

  it('in a build: a broken comparison stops it with its message and the old site stays as it was', () => {
    write(COMPARISON);
    const ok = run(['build', content, '--out', 'site', '--no-pdf', '--no-cache']);
    expect(ok.status, ok.stderr).toBe(0);
    expect(ok.stdout).toMatch(/^built 1 part and 1 comparison into/);
    expect(existsSync(join(dir, 'site/comparisons/copies/index.html'))).toBe(true);
    const before = readFileSync(join(dir, 'site/comparisons/copies/index.html'), 'utf8');
    write(COMPARISON.replace('baseline: Ours', 'baseline: Theirs'));
    const r = run(['build', content, '--out', 'site', '--no-pdf', '--no-cache']);
    expect(r.status).toBe(1);
    expect(r.stderr).toContain('copies.yaml:11:11: error: baseline "Theirs"');
    expect(readFileSync(join(dir, 'site/comparisons/copies/index.html'), 'utf8')).toBe(before);
    rmSync(file());
  });
});
