/**
 * Change limits (qualification stress deltas) on two hand-made Touchstone
 * files of one unit: |S21| −1.00 dB before (1, 2, 3 GHz) and −1.08 dB after,
 * on another grid (1, 1.5, 2.5, 3 GHz): insertion loss −20·log10|S21| rises by
 * exactly 0.08 dB at every point of the common grid, so the change is
 * 0.08 dB everywhere (by hand). Through the binary: `figures --json` carries
 * it as an ordinary result plus "change".
 */
import { spawnSync } from 'node:child_process';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';

const BIN = join(import.meta.dirname, '../../bin/scatterbook.js');
let dir: string;
const run = (args: string[]) => spawnSync(process.execPath, [BIN, ...args], { cwd: dir, encoding: 'utf8' });

/** A version 1 DB file: S11 and S22 at −30 dB, S21 = S12 at the given dB. */
const file = (points: Array<[number, number]>) =>
  `! hand-made for the change-limit test\n# GHz S DB R 50\n${points.map(([f, db]) => `${f} -30 0 ${db} 0 ${db} 0 -30 0`).join('\n')}\n`;

const PART = (limits: string, more = '') => `part: Q-1
class: attenuator
measurements:
  - {unit: U1, file: u1-initial.s2p, conditions: {stage: initial}}
  - {unit: U1, file: u1-cycled.s2p, conditions: {stage: after thermal cycling}}
${more}bands:
  b: {from: 1.2 GHz, to: 2.8 GHz}
limits:
${limits}
`;
const CHANGE = '  - {figure: insertion-loss, on: S21, band: b, change: {from: {stage: initial}, to: {stage: after thermal cycling}}, max: 0.1 dB}';

beforeAll(() => {
  dir = mkdtempSync(join(tmpdir(), 'scatterbook-change-'));
  writeFileSync(
    join(dir, 'u1-initial.s2p'),
    file([
      [1, -1],
      [2, -1],
      [3, -1],
    ]),
  );
  writeFileSync(
    join(dir, 'u1-cycled.s2p'),
    file([
      [1, -1.08],
      [1.5, -1.08],
      [2.5, -1.08],
      [3, -1.08],
    ]),
  );
  writeFileSync(
    join(dir, 'u2-initial.s2p'),
    file([
      [1, -1],
      [2, -1],
      [3, -1],
    ]),
  );
});

describe('change limits', () => {
  it('a known 0.08 dB change: worst 0.08 dB, margin 0.02 dB, pass; the result carries its two stages', () => {
    writeFileSync(join(dir, 'part.yaml'), PART(CHANGE));
    const r = run(['figures', 'part.yaml', '--json']);
    expect(r.stderr).toBe('');
    const res = JSON.parse(r.stdout).results[0];
    expect(Object.keys(res)).toEqual([
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
      'change',
    ]);
    expect(Math.abs(res.worst - 0.08)).toBeLessThan(1e-12);
    expect(Math.abs(res.margin - 0.02)).toBeLessThan(1e-12);
    expect(res.pass).toBe(true);
    expect(res.worstUnit).toBe('U1');
    expect(res.units).toHaveLength(1);
    expect(res.change).toEqual({ from: { stage: 'initial' }, to: { stage: 'after thermal cycling' } });
    // worst ties go to the lowest frequency: the band's lower edge
    expect(res.worstAtHz).toBe(1.2e9);
  });

  it('a unit missing a stage is an error naming it; a stage no unit has, and a figure without per-point values, are positioned errors', () => {
    writeFileSync(join(dir, 'part.yaml'), PART(CHANGE, '  - {unit: U2, file: u2-initial.s2p, conditions: {stage: initial}}\n'));
    const a = run(['figures', 'part.yaml']);
    expect(a.status).toBe(1);
    expect(a.stderr).toMatch(
      /^part\.yaml:10:5: error: unit U2 has no measurement at stage: after thermal cycling; a change limit needs each unit measured once at both stages/,
    );
    writeFileSync(join(dir, 'part.yaml'), PART(CHANGE.replace('stage: after thermal cycling}}', 'stage: after shock}}')));
    expect(run(['figures', 'part.yaml']).stderr).toMatch(
      /^part\.yaml:9:\d+: error: no measured unit has stage: after shock; the units have stage initial, after thermal cycling/,
    );
    writeFileSync(join(dir, 'part.yaml'), PART(CHANGE.replace('figure: insertion-loss', 'figure: passband-ripple')));
    expect(run(['figures', 'part.yaml']).stderr).toMatch(
      /error: a change limit compares a figure point by point between two stages, and passband-ripple has one value per unit/,
    );
  });
});
