/**
 * `scatterbook figures` through the real binary: the JSON shape, the table,
 * exit codes 0 / 1 / 2 / 3, and the errors only the files can show (paths
 * leaving the folder, missing files, bad Touchstone data).
 */
import { spawnSync } from 'node:child_process';
import { cpSync, mkdirSync, mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';

const ROOT = join(import.meta.dirname, '../..');
const BIN = join(ROOT, 'bin/scatterbook.js');
const DEMO = join(ROOT, 'content/parts/vt-bpf-2450');
let dir: string;

function run(args: string[], cwd = dir) {
  const r = spawnSync(process.execPath, [BIN, ...args], { cwd, encoding: 'utf8' });
  return { status: r.status, stdout: r.stdout, stderr: r.stderr };
}

const PART = `part: T-FAIL
class: filter
revision: C
measurements:
  - {unit: A1, file: data/a1.s2p}
bands:
  pass: {from: 1 GHz, to: 2 GHz}
limits:
  - {figure: insertion-loss, on: S21, band: pass, max: 0.5 dB}
  - {figure: return-loss, on: S11, band: pass, min: 10 dB}
`;

beforeAll(() => {
  dir = mkdtempSync(join(tmpdir(), 'scatterbook-figures-'));
  mkdirSync(join(dir, 'fail/data'), { recursive: true });
  writeFileSync(join(dir, 'fail/part.yaml'), PART);
  writeFileSync(join(dir, 'fail/data/a1.s2p'), '# GHz S DB R 50\n1 -30 0 -0.4 0 -0.4 0 -30 0\n2 -25 0 -0.7 0 -0.7 0 -25 0\n');
  cpSync(DEMO, join(dir, 'demo'), { recursive: true });
});

describe('scatterbook figures', () => {
  it('--json gives exactly the documented shape, results in the order of limits', () => {
    const r = run(['figures', 'fail/part.yaml', '--json']);
    expect(r.status).toBe(0); // it evaluated, even though a limit fails
    const j = JSON.parse(r.stdout);
    expect(Object.keys(j)).toEqual(['part', 'revision', 'pass', 'results', 'warnings']);
    expect(j).toMatchObject({ part: 'T-FAIL', revision: 'C', pass: false });
    expect(Object.keys(j.results[0])).toEqual([
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
    expect(j.results[0]).toMatchObject({
      figure: 'insertion-loss',
      on: ['S21'],
      band: 'pass',
      fromHz: 1e9,
      toHz: 2e9,
      unit: 'dB',
      limit: { max: 0.5 },
      worstAtHz: 2e9,
      worstUnit: 'A1',
      worstOn: 'S21',
      pass: false,
    });
    expect(j.results[0].worst).toBeCloseTo(0.7, 12);
    expect(j.results[0].margin).toBeCloseTo(-0.2, 12);
    expect(Object.keys(j.results[0].units[0])).toEqual(['unit', 'worst', 'atHz', 'margin', 'pass']);
    expect(j.results[1]).toMatchObject({ figure: 'return-loss', pass: true, worstAtHz: 2e9 });
    expect(j.warnings).toEqual([]);
  });

  it('--strict exits 3 when a limit fails, 0 when all pass', () => {
    expect(run(['figures', 'fail/part.yaml', '--strict']).status).toBe(3);
    expect(run(['figures', 'demo/part.yaml', '--strict']).status).toBe(0);
  });

  it('a table on a terminal-less stdout: no colour, one row per limit, PASS/FAIL', () => {
    const r = run(['figures', 'fail/part.yaml']);
    expect(r.stdout).toContain('T-FAIL revision C: FAIL');
    expect(r.stdout).toMatch(/Insertion loss +S21 +pass +≤ 0\.50 dB +0\.70 dB +0\.70 dB \(A1\) +2 GHz +−0\.20 dB +FAIL/);
    expect(r.stdout).not.toContain('\x1b[');
  });

  it('bad spec: exit 1, FILE:LINE:COL with the source line and a caret, nothing on stdout', () => {
    writeFileSync(join(dir, 'fail/broken.yaml'), PART.replace('band: pass, max', 'band: passs, max'));
    const r = run(['figures', 'fail/broken.yaml']);
    expect(r.status).toBe(1);
    expect(r.stdout).toBe('');
    expect(r.stderr).toBe(
      'fail/broken.yaml:9:45: error: band "passs" is not defined; did you mean "pass"?\n' +
        '    - {figure: insertion-loss, on: S21, band: passs, max: 0.5 dB}\n' +
        `  ${' '.repeat(44)}^\n`,
    );
  });

  it("a measurement file outside the part's folder is refused", () => {
    writeFileSync(join(dir, 'fail/outside.yaml'), PART.replace('file: data/a1.s2p', 'file: ../../etc/passwd.s2p'));
    const r = run(['figures', 'fail/outside.yaml']);
    expect(r.status).toBe(1);
    expect(r.stderr).toMatch(/^fail\/outside\.yaml:5:22: error: measurement file "\.\.\/\.\.\/etc\/passwd\.s2p" of unit A1 lies outside the content folder/);
  });

  it('a missing measurement file', () => {
    writeFileSync(join(dir, 'fail/missing.yaml'), PART.replace('file: data/a1.s2p', 'file: data/a9.s2p'));
    const r = run(['figures', 'fail/missing.yaml']);
    expect(r.status).toBe(1);
    expect(r.stderr).toMatch(/^fail\/missing\.yaml:5:22: error: measurement file "data\/a9\.s2p" of unit A1 does not exist/);
  });

  it('bad Touchstone data is reported at its own file and line', () => {
    writeFileSync(join(dir, 'fail/data/bad.s2p'), '# GHz S DB R 50\n1 -30 0 -0.4 0 -0.4 0 -30\n');
    writeFileSync(join(dir, 'fail/bad-data.yaml'), PART.replace('file: data/a1.s2p', 'file: data/bad.s2p'));
    const r = run(['figures', 'fail/bad-data.yaml']);
    expect(r.status).toBe(1);
    expect(r.stderr).toMatch(/^fail\/data\/bad\.s2p:2:1: error: the point that starts at line 2 has 8 values/);
  });

  it('bad usage exits 2', () => {
    expect(run(['figures']).status).toBe(2);
    expect(run(['figures', 'a.yaml', 'b.yaml']).status).toBe(2);
    expect(run(['figures', 'fail/part.yaml', '--jason']).stderr).toContain('did you mean --json?');
  });
});
