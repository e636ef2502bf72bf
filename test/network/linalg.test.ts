/**
 * Singular values against two identities that need no eigen-solver:
 * Σσ² = ‖S‖F² (the trace of SᴴS) and Πσ = |det S| (by Gaussian elimination
 * here, written independently of the library's routines), and the 2×2 closed
 * form of the spectral norm against the general routine.
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { singularValues, spectralNorm } from '../../src/network/linalg.js';

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
      const fr = (xr * pr + xi * pi) / d, fi = (xi * pr - xr * pi) / d;
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
