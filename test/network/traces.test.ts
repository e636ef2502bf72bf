import { describe, expect, it } from 'vitest';
import { entry } from '../../src/network/network.js';
import { db, groupDelay, lossDb, mismatchLoss, phaseDeg, phaseUnwrappedDeg, unwrapDeg, vswr } from '../../src/network/traces.js';
import { expectClose, networkOf, cx, polar } from '../helpers.js';

const oneport = (gammas: number[]) =>
  networkOf(
    gammas.map((_, k) => 1e9 + k),
    50,
    (_, k) => [[cx(gammas[k])]],
  );

describe('return loss, VSWR and mismatch loss', () => {
  // Check values computed by hand from the definitions (RL = −20·log10|Γ|,
  // VSWR = (1+|Γ|)/(1−|Γ|), ML = −10·log10(1−|Γ|²), Pozar ch. 2, from memory).
  const table = [
    { rl: 6, gamma: 0.5012, vswr: 3.01, ml: 1.256 },
    { rl: 9.54, gamma: 0.3334, vswr: 2.0, ml: NaN },
    { rl: 10, gamma: 0.3162, vswr: 1.925, ml: 0.458 },
    { rl: 20, gamma: 0.1, vswr: 1.222, ml: 0.0436 },
    { rl: 30, gamma: 0.0316, vswr: 1.065, ml: NaN },
  ];
  for (const row of table) {
    it(`RL ${row.rl} dB ↔ |Γ| ${row.gamma} ↔ VSWR ${row.vswr}`, () => {
      const g = Math.pow(10, -row.rl / 20);
      expectClose(g, row.gamma, 1e-4, '|Γ|'); // table rounded to 4 digits
      const t = entry(oneport([g]), 1, 1);
      expectClose(lossDb(t)[0], row.rl, 1e-12, 'return loss');
      expectClose(vswr(t)[0], row.vswr, 1e-3, 'VSWR'); // table rounded to 3 decimals
      if (!Number.isNaN(row.ml)) expectClose(mismatchLoss(t)[0], row.ml, 1e-3, 'mismatch loss');
    });
  }

  it('10 dB return loss reflects 10 % of the power, 20 dB reflects 1 % (common practice)', () => {
    expectClose(Math.pow(10, -10 / 20) ** 2, 0.1, 1e-15);
    expectClose(Math.pow(10, -20 / 20) ** 2, 0.01, 1e-15);
  });

  it('an ideal short (S11 = −1) has 0 dB return loss, infinite VSWR and a phase of 180°', () => {
    const t = entry(oneport([-1]), 1, 1);
    expect(lossDb(t)[0]).toBe(-0);
    expect(vswr(t)[0]).toBe(Infinity);
    expect(phaseDeg(t)[0]).toBe(180);
  });
});

describe('phase and group delay of a lossless line', () => {
  // S21 = e^(−jβl), β = 2πf/v: a 1 m air line delays by l/c = 3.33564 ns (c = 299 792 458 m/s exactly, by the SI definition of the metre);
  // at εr = 2.1, by √2.1·l/c = 4.8338 ns.
  const c0 = 299_792_458;
  const line = (len: number, er: number, freqs: number[]) =>
    networkOf(freqs, 50, (f) => {
      const ph = (-360 * f * len * Math.sqrt(er)) / c0;
      return [
        [cx(0), polar(1, ph)],
        [polar(1, ph), cx(0)],
      ];
    });

  it('1 m in air: group delay 3.33564 ns on a uniform grid, −1200.83° at 1 GHz unwrapped', () => {
    const freqs = Array.from({ length: 201 }, (_, k) => 5e6 * (k + 1)); // 5 MHz steps: 6° per step
    const net = line(1, 1, freqs);
    const t = entry(net, 2, 1);
    const gd = groupDelay(net.freqHz, t);
    for (const v of gd) expectClose(v, 3.33564e-9, 1e-14, 'τ');
    const k1g = freqs.indexOf(1e9);
    expectClose(phaseUnwrappedDeg(t)[k1g], -1200.83, 0.005, '∠S21 at 1 GHz');
    expectClose(db(t)[k1g], 0, 1e-12, '|S21| dB');
  });

  it('1 m of PTFE (εr 2.1): 4.8338 ns on a non-uniform grid, any aperture', () => {
    const freqs = [1e6, 3e6, 4e6, 10e6, 11e6, 20e6, 40e6, 41e6];
    const net = line(1, 2.1, freqs);
    for (const ap of [1, 2, 3]) {
      for (const v of groupDelay(net.freqHz, entry(net, 2, 1), ap)) expectClose(v, 4.8338e-9, 1e-13, `τ (aperture ${ap})`);
    }
  });

  it('a single point has no group delay', () => {
    const net = line(1, 1, [1e9]);
    expect(Number.isNaN(groupDelay(net.freqHz, entry(net, 2, 1))[0])).toBe(true);
  });
});

describe('unwrapping follows numpy.unwrap', () => {
  // Expected values printed by numpy 1.24's np.unwrap on the same sequences (in radians, converted).
  it('adds whole turns where a step passes 180°, and keeps steps of exactly ±180°', () => {
    expect(Array.from(unwrapDeg(Float64Array.of(170, -170, 175, -5)))).toEqual([170, 190, 175, -5]);
    expect(Array.from(unwrapDeg(Float64Array.of(0, 180, 0, -180)))).toEqual([0, 180, 0, -180]);
    expect(Array.from(unwrapDeg(Float64Array.of(0, -90, 179, -179)))).toEqual([0, -90, -181, -179]);
  });
});
