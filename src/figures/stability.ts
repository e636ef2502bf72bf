/**
 * Stability of a 2-port (ports a → b; S11 = Saa, S21 = Sba, S12 = Sab, S22 = Sbb):
 *   Δ = S11·S22 − S12·S21
 *   stability-k (Rollett): K = (1 − |S11|² − |S22|² + |Δ|²) / (2|S12·S21|); with |Δ| < 1, K > 1 is the test
 *   stability-mu (Edwards & Sinsky 1992): μ = (1 − |S11|²) / (|S22 − Δ·conj(S11)| + |S12·S21|); μ > 1 alone suffices
 *   stability-delta: |Δ|
 * K has no value where S12·S21 = 0 (no reverse transmission): that is reported, never taken as ∞.
 */
import { entry } from '../network/network.js';
import type { FigureContext, FigureDef, Item } from './types.js';

interface Four {
  s11r: Float64Array; s11i: Float64Array; s21r: Float64Array; s21i: Float64Array;
  s12r: Float64Array; s12i: Float64Array; s22r: Float64Array; s22i: Float64Array;
}

function four(ctx: FigureContext, item: Item): Four {
  const [p11, p21, p12, p22] = item.params;
  const g = (p: (typeof item.params)[number]) => entry(ctx.network, p.to, p.from);
  const a = g(p11), b = g(p21), c = g(p12), d = g(p22);
  return { s11r: a.re, s11i: a.im, s21r: b.re, s21i: b.im, s12r: c.re, s12i: c.im, s22r: d.re, s22i: d.im };
}

function perPointStability(ctx: FigureContext, item: Item, f: (k: number, v: Four, dr: number, di: number, pr: number, pi: number) => number): Float64Array {
  const v = four(ctx, item);
  const n = v.s11r.length;
  const out = new Float64Array(n);
  for (let k = 0; k < n; k++) {
    // p = S12·S21, Δ = S11·S22 − p
    const pr = v.s12r[k] * v.s21r[k] - v.s12i[k] * v.s21i[k];
    const pi = v.s12r[k] * v.s21i[k] + v.s12i[k] * v.s21r[k];
    const dr = v.s11r[k] * v.s22r[k] - v.s11i[k] * v.s22i[k] - pr;
    const di = v.s11r[k] * v.s22i[k] + v.s11i[k] * v.s22r[k] - pi;
    out[k] = f(k, v, dr, di, pr, pi);
  }
  return out;
}

export const STABILITY_FIGURES: readonly FigureDef[] = [
  {
    id: 'stability-k',
    title: 'Stability factor K',
    unit: '',
    operands: 'port-pair',
    shape: 'trace',
    worse: 'lower',
    definition: 'Rollett: (1 − |S11|² − |S22|² + |Δ|²)/(2|S12·S21|), Δ = S11·S22 − S12·S21',
    undefinedWhere: 'S12·S21 = 0 (no reverse transmission), where K has no value; stability-mu is defined there',
    perPoint: (ctx, item) =>
      perPointStability(ctx, item, (k, v, dr, di, pr, pi) => {
        const p = Math.hypot(pr, pi);
        if (p === 0) return NaN;
        return (1 - (v.s11r[k] ** 2 + v.s11i[k] ** 2) - (v.s22r[k] ** 2 + v.s22i[k] ** 2) + dr * dr + di * di) / (2 * p);
      }),
  },
  {
    id: 'stability-mu',
    title: 'Stability factor μ',
    unit: '',
    operands: 'port-pair',
    shape: 'trace',
    worse: 'lower',
    definition: 'Edwards–Sinsky: (1 − |S11|²)/(|S22 − Δ·conj(S11)| + |S12·S21|)',
    undefinedWhere: 'S22 − Δ·conj(S11) and S12·S21 both vanish',
    perPoint: (ctx, item) =>
      perPointStability(ctx, item, (k, v, dr, di, pr, pi) => {
        // Δ·conj(S11)
        const xr = dr * v.s11r[k] + di * v.s11i[k];
        const xi = di * v.s11r[k] - dr * v.s11i[k];
        const den = Math.hypot(v.s22r[k] - xr, v.s22i[k] - xi) + Math.hypot(pr, pi);
        if (den === 0) return NaN;
        return (1 - (v.s11r[k] ** 2 + v.s11i[k] ** 2)) / den;
      }),
  },
  {
    id: 'stability-delta',
    title: 'Stability |Δ|',
    unit: '',
    operands: 'port-pair',
    shape: 'trace',
    worse: 'higher',
    definition: '|Δ| = |S11·S22 − S12·S21| (with K > 1, |Δ| < 1 completes the Rollett test)',
    perPoint: (ctx, item) => perPointStability(ctx, item, (_k, _v, dr, di) => Math.hypot(dr, di)),
  },
];
