/**
 * Scalar complex arithmetic for the closed-form 2-port formulas. Small
 * immutable values; the per-matrix work of N-ports lives in linalg.ts.
 */
export interface C {
  readonly re: number;
  readonly im: number;
}

export const c = (re: number, im = 0): C => ({ re, im });
export const ONE: C = c(1);
export const ZERO: C = c(0);

export const add = (a: C, b: C): C => c(a.re + b.re, a.im + b.im);
export const sub = (a: C, b: C): C => c(a.re - b.re, a.im - b.im);
export const mul = (a: C, b: C): C => c(a.re * b.re - a.im * b.im, a.re * b.im + a.im * b.re);
export const scale = (a: C, f: number): C => c(a.re * f, a.im * f);
export const neg = (a: C): C => c(-a.re, -a.im);

export function div(a: C, b: C): C {
  const d = b.re * b.re + b.im * b.im;
  return c((a.re * b.re + a.im * b.im) / d, (a.im * b.re - a.re * b.im) / d);
}

/** Reads element (i, j) of the n×n matrix at `a[off…]`. */
export function at(a: Float64Array, off: number, n: number, i: number, j: number): C {
  const p = off + 2 * (i * n + j);
  return c(a[p], a[p + 1]);
}

/** Writes element (i, j) of the n×n matrix at `a[off…]`. */
export function put(a: Float64Array, off: number, n: number, i: number, j: number, v: C): void {
  const p = off + 2 * (i * n + j);
  a[p] = v.re;
  a[p + 1] = v.im;
}
