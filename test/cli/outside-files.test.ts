/**
 * Files from outside the project (scikit-rf's example and test data, copied
 * with their licence into test/data/outside/scikit-rf/, see ORIGIN.md) through
 * the real binary: a name with a space keeps its error and warning labels, and
 * the reader's warnings — here a field-solver export whose comments carry port
 * impedances that are not 50 Ω — reach `figures` (stderr and the JSON's
 * `warnings`), `build` (stderr) and the test report, not the datasheet.
 */
import { spawnSync } from 'node:child_process';
import { copyFileSync, mkdirSync, mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';

const BIN = join(import.meta.dirname, '../../bin/scatterbook.js');
const OUTSIDE = join(import.meta.dirname, '../data/outside/scikit-rf');
let dir: string;

function run(...args: string[]) {
  const r = spawnSync(process.execPath, [BIN, ...args], { cwd: dir, encoding: 'utf8', env: { ...process.env, NO_COLOR: '1' } });
  return { status: r.status, stdout: r.stdout, stderr: r.stderr };
}

const IMPEDANCE_WARNING =
  'a comment mentions port impedances (as some simulators write); comments are not Touchstone data, so the references come from the option line or [Reference]';

beforeAll(() => {
  dir = mkdtempSync(join(tmpdir(), 'scatterbook-outside-'));
  // the last line of ring slot.s2p (204 lines) cut after its fifth value
  const lines = readFileSync(join(OUTSIDE, 'ring slot.s2p'), 'latin1').split('\n');
  lines[203] = lines[203].split(' ').slice(0, 5).join(' ');
  writeFileSync(join(dir, 'ring slot cut.s2p'), lines.join('\n'));
  const part = join(dir, 'content/parts/gnd-cpw');
  mkdirSync(join(part, 'data'), { recursive: true });
  copyFileSync(join(OUTSIDE, 'hfss_twoport.s2p'), join(part, 'data/hfss_twoport.s2p'));
  writeFileSync(
    join(part, 'part.yaml'),
    'part: GC-1\ntitle: Grounded coplanar line (a field-solver export)\nrevision: A\nclass: cable\nmeasurements:\n  - {unit: M1, file: data/hfss_twoport.s2p}\nbands:\n  w: {from: 75 GHz, to: 110 GHz}\nlimits:\n  - {figure: insertion-loss, on: S21, band: w, max: 1 dB}\n',
  );
}, 30_000);

describe('outside files (scikit-rf 0.15.4 data, BSD 3-clause)', () => {
  it('read: each file reads; a name with a space keeps its "error:" label and line', () => {
    for (const [name, ports, points] of [
      ['ring slot.s2p', 2, 201],
      ['ntwk1.s2p', 2, 91],
      ['tee.s3p', 3, 201],
      ['hfss_twoport.s2p', 2, 101],
    ] as const) {
      const r = run('read', join(OUTSIDE, name), '--json');
      expect(r.status, name).toBe(0);
      const j = JSON.parse(r.stdout);
      expect([j.ports, j.frequencyHz.length], name).toEqual([ports, points]);
    }
    const cut = run('read', 'ring slot cut.s2p');
    expect(cut.status).toBe(1);
    expect(cut.stderr).toBe(
      'ring slot cut.s2p:204: error: the point that starts at line 204 has 5 values; a 2-port point holds 9 values (the frequency and 4 pairs in the order N11 N21 N12 N22); if these are noise parameters, they must start at a frequency not above the last network frequency\n',
    );
  });

  it('read: the port-impedance comment of a field-solver export is a warning at its line', () => {
    const r = run('read', join(OUTSIDE, 'hfss_twoport.s2p'));
    expect(r.status).toBe(0);
    expect(r.stderr).toContain(`hfss_twoport.s2p:25: warning: ${IMPEDANCE_WARNING}`);
  });

  it('figures: the reader warning on stderr and first in the JSON warnings, with file and line', () => {
    const text = run('figures', 'content/parts/gnd-cpw/part.yaml');
    expect(text.status).toBe(0);
    expect(text.stderr).toContain(`content/parts/gnd-cpw/data/hfss_twoport.s2p:25:1: warning: ${IMPEDANCE_WARNING}`);
    const json = run('figures', 'content/parts/gnd-cpw/part.yaml', '--json');
    expect(JSON.parse(json.stdout).warnings[0]).toEqual({
      code: 'touchstone',
      file: 'content/parts/gnd-cpw/data/hfss_twoport.s2p',
      line: 25,
      column: 1,
      message: IMPEDANCE_WARNING,
    });
  });

  it('build: the warning on stderr and on the test report with its position; the datasheet, for customers, leaves it out', () => {
    const r = run('build', 'content', '--out', 'site', '--no-pdf', '--no-cache');
    expect(r.status, r.stderr).toBe(0);
    expect(r.stderr).toContain(`content/parts/gnd-cpw/data/hfss_twoport.s2p:25:1: warning: ${IMPEDANCE_WARNING}`);
    const report = readFileSync(join(dir, 'site/parts/gnd-cpw/report.html'), 'utf8');
    expect(report).toContain('<span class="sub">content/parts/gnd-cpw/data/hfss_twoport.s2p:25:1</span> a comment mentions port impedances');
    const sheet = readFileSync(join(dir, 'site/parts/gnd-cpw/index.html'), 'utf8');
    // (the embedded figures JSON, the same as figures --json, keeps it for machine readers)
    expect(sheet).not.toContain('<div class="warnings"');
    expect(sheet.replace(/<script type="application\/json"[\s\S]*?<\/script>/g, '')).not.toContain('a comment mentions port impedances');
  });
});
