/** Shared test helpers: building small networks and comparing numbers with stated tolerances. */
import { expect } from 'vitest';
import { makeNetwork, type Network } from '../src/network/network.js';

export type Cx = [number, number];
/** S matrix at one frequency as rows of [re, im]. */
export type Matrix = Cx[][];

/** A network from a function giving the matrix at each frequency. */
export function networkOf(freqHz: number[], z0: number | number[], sAt: (f: number, k: number) => Matrix): Network {
  const m0 = sAt(freqHz[0], 0);
  const n = m0.length;
  const s = new Float64Array(freqHz.length * n * n * 2);
  freqHz.forEach((f, k) => {
    const m = k === 0 ? m0 : sAt(f, k);
    for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) {
      s[2 * ((k * n + i) * n + j)] = m[i][j][0];
      s[2 * ((k * n + i) * n + j) + 1] = m[i][j][1];
    }
  });
  const z = typeof z0 === 'number' ? new Float64Array(n).fill(z0) : Float64Array.from(z0);
  return makeNetwork(Float64Array.from(freqHz), z, s, n);
}

export const cx = (re: number, im = 0): Cx => [re, im];
export const polar = (mag: number, deg: number): Cx => [mag * Math.cos((deg * Math.PI) / 180), mag * Math.sin((deg * Math.PI) / 180)];

/** S(i+1)(j+1) at frequency k. */
export function sAt(net: Network, k: number, i: number, j: number): Cx {
  const p = 2 * ((k * net.ports + i - 1) * net.ports + j - 1);
  return [net.s[p], net.s[p + 1]];
}

export function expectClose(actual: number, expected: number, tol: number, what = ''): void {
  if (!(Math.abs(actual - expected) <= tol)) {
    throw new Error(`${what ? what + ': ' : ''}expected ${expected} ± ${tol}, got ${actual} (off by ${Math.abs(actual - expected)})`);
  }
  expect(true).toBe(true);
}

export function expectComplexClose(actual: Cx, expected: Cx, tol: number, what = ''): void {
  const d = Math.hypot(actual[0] - expected[0], actual[1] - expected[1]);
  if (!(d <= tol)) throw new Error(`${what ? what + ': ' : ''}expected ${expected[0]}${expected[1] >= 0 ? '+' : ''}${expected[1]}j ± ${tol}, got ${actual[0]}${actual[1] >= 0 ? '+' : ''}${actual[1]}j`);
}

/** Largest |a − b| over arrays, or over interleaved complex arrays. */
export function maxAbsDiff(a: ArrayLike<number>, b: ArrayLike<number>): number {
  expect(a.length).toBe(b.length);
  let m = 0;
  for (let i = 0; i < a.length; i++) m = Math.max(m, Math.abs(a[i] - b[i]));
  return m;
}
