import { describe, expect, it } from 'vitest';
import { sToZ } from '../../src/network/convert.js';
import {
  abcdToS,
  cascade,
  sToAbcd,
  sToT,
  tToS,
  sToHNormalized,
  hNormalizedToSInPlace,
  sToGNormalized,
  gNormalizedToSInPlace,
} from '../../src/network/twoport.js';
import { expectComplexClose, networkOf, cx, polar, sAt, maxAbsDiff } from '../helpers.js';

const c0 = 299_792_458;
const line = (len: number, z0 = 50) =>
  networkOf([1e9, 2e9, 3e9], z0, (f) => {
    const t = polar(1, (-360 * f * len) / c0);
    return [
      [cx(0), t],
      [t, cx(0)],
    ];
  });

describe('ABCD (Pozar table 4.1, from memory)', () => {
  it('a matched lossless line of βl: A = D = cos βl, B = jZ0 sin βl, C = j sin βl / Z0', () => {
    const net = line(0.05);
    const m = sToAbcd(net).data;
    net.freqHz.forEach((f, k) => {
      const bl = (2 * Math.PI * f * 0.05) / c0;
      const o = 8 * k;
      expectComplexClose([m[o], m[o + 1]], [Math.cos(bl), 0], 1e-12, 'A');
      expectComplexClose([m[o + 2], m[o + 3]], [0, 50 * Math.sin(bl)], 1e-10, 'B');
      expectComplexClose([m[o + 4], m[o + 5]], [0, Math.sin(bl) / 50], 1e-14, 'C');
      expectComplexClose([m[o + 6], m[o + 7]], [Math.cos(bl), 0], 1e-12, 'D');
    });
  });

  it('round trips with unequal references, and A = Z11/Z21 (the route through Z)', () => {
    const net = networkOf([1e9], [50, 75], () => [
      [cx(0.2, 0.1), cx(0.6, -0.3)],
      [cx(0.6, -0.3), cx(-0.1, 0.25)],
    ]);
    const abcd = sToAbcd(net);
    expect(maxAbsDiff(abcdToS(abcd, [50, 75]).s, net.s)).toBeLessThan(1e-14);
    const z = sToZ(net).data;
    const [z11, z21] = [
      [z[0], z[1]],
      [z[4], z[5]],
    ];
    const d = z21[0] ** 2 + z21[1] ** 2;
    const a = [(z11[0] * z21[0] + z11[1] * z21[1]) / d, (z11[1] * z21[0] - z11[0] * z21[1]) / d] as [number, number];
    expectComplexClose([abcd.data[0], abcd.data[1]], a, 1e-13, 'A');
  });
});

describe('T parameters and cascading', () => {
  it('round trips S → T → S', () => {
    const net = networkOf([1e9], 50, () => [
      [cx(0.2, 0.1), cx(0.6, -0.3)],
      [cx(0.5, -0.2), cx(-0.1, 0.25)],
    ]);
    expect(maxAbsDiff(tToS(sToT(net)).s, net.s)).toBeLessThan(1e-15);
  });

  it('two matched lines cascade into the line of their summed length', () => {
    const ab = cascade(line(0.03), line(0.02));
    const whole = line(0.05);
    expect(maxAbsDiff(ab.s, whole.s)).toBeLessThan(1e-13);
  });

  it('a 50 Ω and a 75 Ω section: the junction is renormalized, the result is the same as ABCD multiplication', () => {
    const a = line(0.03, 50);
    const b = networkOf([1e9, 2e9, 3e9], 75, () => [
      [cx(0.1), cx(0.9)],
      [cx(0.9), cx(0.1)],
    ]);
    const ab = cascade(a, b);
    expect(Array.from(ab.z0)).toEqual([50, 75]);
    // ABCD of the whole = ABCD(a) · ABCD(b); ABCD does not depend on references.
    const ma = sToAbcd(a).data,
      mb = sToAbcd(b).data,
      mab = sToAbcd(ab).data;
    for (let k = 0; k < 3; k++) {
      const o = 8 * k;
      const A = (i: number, j: number, m: Float64Array) => [m[o + 2 * (2 * i + j)], m[o + 2 * (2 * i + j) + 1]];
      for (let i = 0; i < 2; i++)
        for (let j = 0; j < 2; j++) {
          let re = 0,
            im = 0;
          for (let q = 0; q < 2; q++) {
            const x = A(i, q, ma),
              y = A(q, j, mb);
            re += x[0] * y[0] - x[1] * y[1];
            im += x[0] * y[1] + x[1] * y[0];
          }
          expectComplexClose(A(i, j, mab) as [number, number], [re, im], 1e-11, `ABCD ${i}${j} at ${k}`);
        }
    }
  });
});

describe('hybrid H and inverse-hybrid G', () => {
  const net = networkOf([1e9], 1, () => [
    [cx(0.2, 0.1), cx(0.05, -0.3)],
    [cx(2.5, -0.2), cx(-0.1, 0.25)],
  ]);

  it('H: h11 = Z11 − Z12·Z21/Z22 (definition V1 = h11 I1 + h12 V2 with V2 = 0)', () => {
    // at unit reference the normalized h is the absolute h
    const h = sToHNormalized(net.s);
    const z = sToZ(net).data;
    const c = (i: number) => ({ re: z[2 * i], im: z[2 * i + 1] });
    const [z11, z12, z21, z22] = [c(0), c(1), c(2), c(3)];
    const pr = z12.re * z21.re - z12.im * z21.im,
      pi = z12.re * z21.im + z12.im * z21.re;
    const d = z22.re ** 2 + z22.im ** 2;
    const q = [(pr * z22.re + pi * z22.im) / d, (pi * z22.re - pr * z22.im) / d];
    expectComplexClose([h[0], h[1]], [z11.re - q[0], z11.im - q[1]], 1e-13, 'h11');
    // h22 = 1/Z22
    expectComplexClose([h[6], h[7]], [z22.re / d, -z22.im / d], 1e-13, 'h22');
  });

  it('S → H → S and S → G → S round trip', () => {
    expect(maxAbsDiff(hNormalizedToSInPlace(sToHNormalized(net.s)), net.s)).toBeLessThan(1e-14);
    expect(maxAbsDiff(gNormalizedToSInPlace(sToGNormalized(net.s)), net.s)).toBeLessThan(1e-14);
  });

  it('refuses a 3-port', () => {
    const three = networkOf([1e9], 50, () => [
      [cx(0), cx(0), cx(0)],
      [cx(0), cx(0), cx(0)],
      [cx(0), cx(0), cx(0)],
    ]);
    expect(() => sToAbcd(three)).toThrow(/2-ports only/);
  });

  it('reads S back out of a cascade of identical pads as the product of their transmissions', () => {
    const a = Math.pow(10, -3 / 20);
    const pad = networkOf([1e9], 50, () => [
      [cx(0), cx(a)],
      [cx(a), cx(0)],
    ]);
    expectComplexClose(sAt(cascade(pad, pad), 0, 2, 1), [a * a, 0], 1e-15, 'S21 of two 3 dB pads');
  });
});
