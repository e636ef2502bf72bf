/**
 * Singular values against two identities that need no eigen-solver:
 * Σσ² = ‖S‖F² (the trace of SᴴS) and Πσ = |det S| (by Gaussian elimination
 * here, written independently of the library's routines), and the 2×2 closed
 * form of the spectral norm against the general routine; the largest one,
 * by tridiagonal reduction and bisection, against the Jacobi method and
 * against numpy's SVD.
 */
import { execFileSync } from 'node:child_process';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { singularValues, spectralNorm } from '../../src/network/linalg.js';
import { PREREQUISITES, PYTHON } from '../support/prerequisites.js';

const numpy = (PREREQUISITES.find((p) => p.name === 'scikit-rf') as (typeof PREREQUISITES)[number]).present();

function detAbs(m: Float64Array, n: number): number {
  const a = Array.from({ length: n }, (_, i) => Array.from({ length: n }, (_, j) => [m[2 * (i * n + j)], m[2 * (i * n + j) + 1]] as [number, number]));
  let det: [number, number] = [1, 0];
  for (let c = 0; c < n; c++) {
    let p = c;
    for (let r = c + 1; r < n; r++) if (Math.hypot(...a[r][c]) > Math.hypot(...a[p][c])) p = r;
    if (Math.hypot(...a[p][c]) === 0) return 0;
    [a[c], a[p]] = [a[p], a[c]];
    const [pr, pi] = a[c][c];
    det = [det[0] * pr - det[1] * pi, det[0] * pi + det[1] * pr];
    const d = pr * pr + pi * pi;
    for (let r = c + 1; r < n; r++) {
      const [xr, xi] = a[r][c];
      const fr = (xr * pr + xi * pi) / d,
        fi = (xi * pr - xr * pi) / d;
      for (let k = c; k < n; k++) {
        const [yr, yi] = a[c][k];
        a[r][k] = [a[r][k][0] - (fr * yr - fi * yi), a[r][k][1] - (fr * yi + fi * yr)];
      }
    }
  }
  return Math.hypot(...det);
}

describe('singular values', () => {
  it('satisfy Σσ² = ‖S‖F² and Πσ = |det S| on random complex matrices of 1 to 8 ports', () => {
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 8 }), fc.array(fc.double({ min: -1, max: 1, noNaN: true }), { minLength: 128, maxLength: 128 }), (n, vals) => {
        const m = Float64Array.from(vals.slice(0, 2 * n * n), (v) => (Math.abs(v) < 1e-6 ? 0 : v)); // S-parameters, not 1e-300: no underflow in the products
        const sv = singularValues(m, 0, n);
        let fro = 0;
        for (const v of m) fro += v * v;
        const sum = sv.reduce((s, x) => s + x * x, 0);
        expect(Math.abs(sum - fro)).toBeLessThanOrEqual(1e-12 * Math.max(1, fro));
        // small σ come from eigenvalues of SᴴS, so they carry an absolute error of about √ε·σmax
        // (ample for passivity, which needs only σmax): the product identity holds to that
        const prod = sv.reduce((s, x) => s * x, 1);
        expect(Math.abs(prod - detAbs(m, n))).toBeLessThanOrEqual(1e-7 * Math.max(1, sv[0]) ** n);
        for (let i = 1; i < n; i++) expect(sv[i]).toBeLessThanOrEqual(sv[i - 1]);
        expect(Math.abs(spectralNorm(m, 0, n) - sv[0])).toBeLessThanOrEqual(1e-12 * Math.max(1, sv[0]));
      }),
      { numRuns: 300, seed: 370 }, // a fixed seed: CI runs the same matrices every time
    );
  });
});

describe('the largest singular value by tridiagonal reduction and bisection', () => {
  it("equals the Jacobi method's on random complex matrices of 3 to 16 ports, to 1e-12 relative", () => {
    fc.assert(
      fc.property(fc.integer({ min: 3, max: 16 }), fc.array(fc.double({ min: -1, max: 1, noNaN: true }), { minLength: 512, maxLength: 512 }), (n, vals) => {
        const m = Float64Array.from(vals.slice(0, 2 * n * n));
        const jacobi = singularValues(m, 0, n)[0];
        expect(Math.abs(spectralNorm(m, 0, n) - jacobi)).toBeLessThanOrEqual(1e-12 * Math.max(1, jacobi));
      }),
      { numRuns: 300, seed: 2020 },
    );
  });

  it('is exact where all singular values are equal (a unitary S: a lossless network) and where S is zero', () => {
    // a 4-port permutation (a lossless, matched circulator-like S): every σ is 1
    const n = 4,
      m = new Float64Array(2 * n * n);
    for (let i = 0; i < n; i++) m[2 * (((i + 1) % n) * n + i)] = 1;
    expect(Math.abs(spectralNorm(m, 0, n) - 1)).toBeLessThanOrEqual(1e-15);
    expect(spectralNorm(new Float64Array(2 * 9), 0, 3)).toBe(0);
  });

  it.skipIf(!numpy)("equals numpy.linalg.svd on 16-port matrices to 1e-12 relative (Debian's python3-numpy)", () => {
    const n = 16,
      count = 20;
    let seed = 7;
    const rnd = () => ((seed = (seed * 1103515245 + 12345) % 2147483648) / 2147483648) * 2 - 1;
    const mats = Array.from({ length: count }, () => Float64Array.from({ length: 2 * n * n }, rnd));
    const script = `import json, sys, numpy as np
d = json.load(sys.stdin)
a = np.array(d)[..., 0::2] + 1j * np.array(d)[..., 1::2]
print(json.dumps([float(np.linalg.svd(m.reshape(${n}, ${n}), compute_uv=False)[0]) for m in a]))`;
    const ref = JSON.parse(execFileSync(PYTHON, ['-c', script], { input: JSON.stringify(mats.map((m) => Array.from(m))) }).toString()) as number[];
    mats.forEach((m, i) => expect(Math.abs(spectralNorm(m, 0, n) - ref[i])).toBeLessThanOrEqual(1e-12 * ref[i]));
  });
});
