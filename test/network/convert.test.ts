import { describe, expect, it } from 'vitest';
import { renormalize, sToY, sToZ, yToS, zToS } from '../../src/network/convert.js';
import { expectClose, expectComplexClose, networkOf, cx, sAt, maxAbsDiff } from '../helpers.js';

describe('S ↔ Z ↔ Y (Pozar, Microwave Engineering, §4.3: Z = √R(I+S)(I−S)⁻¹√R; from memory)', () => {
  it('a series resistor R between 50 Ω ports: Z11 − Z21 = R; S11 = R/(R + 100)', () => {
    // Series impedance Zs between two 50 Ω ports: S11 = Zs/(Zs + 2Z0), S21 = 2Z0/(Zs + 2Z0) (Pozar table 4.x, from memory).
    // A pure series element has no Z matrix (I − S singular), so we check Y: Y = [[1, −1], [−1, 1]]/Zs.
    const zs = 30;
    const net = networkOf([1e9], 50, () => [
      [cx(zs / (zs + 100)), cx(100 / (zs + 100))],
      [cx(100 / (zs + 100)), cx(zs / (zs + 100))],
    ]);
    const y = sToY(net).data;
    expectComplexClose([y[0], y[1]], [1 / zs, 0], 1e-15, 'Y11');
    expectComplexClose([y[2], y[3]], [-1 / zs, 0], 1e-15, 'Y12');
    const z = sToZ(net).data;
    expect(Number.isNaN(z[0])).toBe(true); // singular: no Z for a series element
  });

  it('a shunt resistor R: Z = R everywhere; S11 = −Z0/(2R + Z0)', () => {
    const r = 75;
    const s11 = -50 / (2 * r + 50),
      s21 = (2 * r) / (2 * r + 50);
    const net = networkOf([1e9], 50, () => [
      [cx(s11), cx(s21)],
      [cx(s21), cx(s11)],
    ]);
    const z = sToZ(net).data;
    for (let e = 0; e < 4; e++) expectComplexClose([z[2 * e], z[2 * e + 1]], [r, 0], 1e-12, `Z element ${e}`);
  });

  it('round trips S → Z → S and S → Y → S at unequal references', () => {
    const net = networkOf([1e9, 2e9], [50, 75, 20], (f) => [
      [cx(0.1, (0.2 * f) / 1e9), cx(0.3, -0.1), cx(0.05, 0.02)],
      [cx(0.3, -0.1), cx(-0.2, 0.1), cx(0.1, 0)],
      [cx(0.05, 0.02), cx(0.1, 0), cx(0.4, -0.3)],
    ]);
    const fromZ = zToS(net.freqHz, sToZ(net).data, net.z0);
    const fromY = yToS(net.freqHz, sToY(net).data, net.z0);
    expect(maxAbsDiff(fromZ.s, net.s)).toBeLessThan(1e-14);
    expect(maxAbsDiff(fromY.s, net.s)).toBeLessThan(1e-14);
  });
});

describe('renormalization', () => {
  // A matched 6 dB attenuator (S21 = 0.5012) renormalized 50 → 75 Ω gives S11 = −0.1513 and S21 = 0.4860:
  // computed by hand from the power-wave renormalization S′ = A⁻¹(S − Γ)(I − ΓS)⁻¹A (Kurokawa, IEEE Trans. MTT 1965),
  // not a published table.
  const a = Math.pow(10, -6 / 20);
  const pad = networkOf([1e9], 50, () => [
    [cx(0), cx(a)],
    [cx(a), cx(0)],
  ]);

  it('matched 6 dB pad, 50 → 75 Ω', () => {
    const r = renormalize(pad, 75);
    expectClose(sAt(r, 0, 1, 1)[0], -0.1513, 5e-5, 'S11');
    expectClose(sAt(r, 0, 2, 1)[0], 0.486, 5e-5, 'S21');
    expect(Array.from(r.z0)).toEqual([75, 75]);
  });

  it('agrees with the route through Z (Z does not depend on the reference)', () => {
    const net = networkOf([1e9], [50, 50, 50], () => [
      [cx(0.1, 0.2), cx(0.3, -0.1), cx(0.05, 0.02)],
      [cx(0.3, -0.1), cx(-0.2, 0.1), cx(0.1, 0)],
      [cx(0.05, 0.02), cx(0.1, 0), cx(0.4, -0.3)],
    ]);
    const target = Float64Array.of(75, 25, 100);
    const viaZ = zToS(net.freqHz, sToZ(net).data, target);
    expect(maxAbsDiff(renormalize(net, target).s, viaZ.s)).toBeLessThan(1e-14);
  });

  it('works where Z does not exist (an ideal thru stays a thru at the same reference)', () => {
    const thru = networkOf([1e9], 50, () => [
      [cx(0), cx(1)],
      [cx(1), cx(0)],
    ]);
    const r = renormalize(thru, 75);
    // an ideal thru holds no impedance of its own, so at any common reference S11 = 0 and S21 = 1
    expectComplexClose(sAt(r, 0, 1, 1), [0, 0], 1e-15);
    expectComplexClose(sAt(r, 0, 2, 1), [1, 0], 1e-15);
  });
});
