/**
 * Lot statistics: mean and sample standard deviation against numpy (Debian's
 * python3-numpy, which python3-scikit-rf depends on: numpy.mean and
 * numpy.std with ddof=1); Cpk on a worked example by hand from the textbook
 * definitions (Montgomery, Introduction to Statistical Quality Control, from
 * memory: Cpk = min(USL − μ, μ − LSL)/(3σ)); grouping by unit, lot and condition.
 */
import { execFileSync } from 'node:child_process';
import { describe, expect, it } from 'vitest';
import { CPK_MIN_UNITS, cpkOf, lotStatistics, stripSvg, summarize } from '../../src/archive/lot.js';
import type { CheckResult } from '../../src/evaluate/evaluate.js';
import { expectClose } from '../helpers.js';
import { PREREQUISITES, PYTHON } from '../support/prerequisites.js';

const numpy = (PREREQUISITES.find((p) => p.name === 'scikit-rf') as (typeof PREREQUISITES)[number]).present();

// twelve attenuation worsts, dB (invented for the test)
const VALUES = [10.02, 9.97, 10.11, 9.88, 10.05, 10.0, 9.93, 10.08, 10.14, 9.91, 10.03, 9.99];

describe('lot statistics', () => {
  it.skipIf(!numpy)('mean and standard deviation equal numpy.mean and numpy.std(ddof=1) to 1e-12', () => {
    const out = execFileSync(PYTHON, [
      '-c',
      `import json, numpy as np; v = np.array(${JSON.stringify(VALUES)}); print(json.dumps([float(np.mean(v)), float(np.std(v, ddof=1)), float(v.min()), float(v.max())]))`,
    ]).toString();
    const [mean, std, min, max] = JSON.parse(out) as number[];
    const s = summarize(VALUES, { max: 10.5 });
    expectClose(s.mean, mean, 1e-12, 'mean');
    expectClose(s.std as number, std, 1e-12, 'std');
    expect([s.count, s.min, s.max]).toEqual([12, min, max]);
  });

  it('Cpk, worked by hand: μ = 53, σ = 2, USL 62, LSL 38 → 1.5 two-sided (62 − 53)/6; max only 1.5; min only (53 − 38)/6 = 2.5', () => {
    expectClose(cpkOf(53, 2, { nominal: 50, tolerance: 12 }), 1.5, 1e-15, 'nominal 50 ± 12');
    expectClose(cpkOf(53, 2, { max: 62 }), 1.5, 1e-15, 'max');
    expectClose(cpkOf(53, 2, { min: 38 }), 2.5, 1e-15, 'min');
    expectClose(cpkOf(53, 2, { min: 38, max: 62 }), 1.5, 1e-15, 'min and max');
  });

  it(`Cpk only from ${CPK_MIN_UNITS} units up, and only against a limit`, () => {
    expect(summarize(VALUES.slice(0, CPK_MIN_UNITS - 1), { max: 10.5 })).toMatchObject({ cpk: null, cpkNote: `fewer than ${CPK_MIN_UNITS} units` });
    expect(summarize(VALUES, null)).toMatchObject({ cpk: null, cpkNote: 'no limit' });
    const s = summarize(VALUES, { max: 10.5 });
    expectClose(s.cpk as number, (10.5 - s.mean) / (3 * (s.std as number)), 1e-15, 'Cpk');
  });

  it('a unit counts once over the lot (its worst over its measurements), once per measurement within a condition; lots and the spread over conditions', () => {
    const unit = (u: string, worst: number) => ({ unit: u, worst, atHz: 1e9, worstOn: 'S21', margin: 1 - worst, pass: worst <= 1 });
    const r = {
      limit: { max: 1 },
      units: [unit('A @ cold', 0.5), unit('A @ hot', 0.7), unit('B @ cold', 0.4), unit('B @ hot', 0.9)],
    } as unknown as CheckResult;
    const info = (u: string) => ({ serial: u[0], lot: u[0] === 'A' ? 'L1' : 'L2', conditions: { temperature: u.split(' @ ')[1] } });
    const s = lotStatistics(r, info);
    expect(s.all.summary.count).toBe(2);
    expect(s.allWorsts).toEqual([0.7, 0.9]);
    expect(s.lots.map((l) => [l.label, l.summary.count, l.worst])).toEqual([
      ['lot L1', 1, 0.7],
      ['lot L2', 1, 0.9],
    ]);
    expect(s.conditions.map((c) => [c.label, c.summary.count, c.worst])).toEqual([
      ['cold', 2, 0.5],
      ['hot', 2, 0.9],
    ]);
    expectClose(s.conditionSpread as number, 0.4, 1e-15, "spread of the conditions' worsts");
    expect(stripSvg(s.allWorsts, r.limit)).toMatch(/^<svg class="strip"[^]*stroke="#c0392b"[^]*<\/svg>$/);
  });
});
