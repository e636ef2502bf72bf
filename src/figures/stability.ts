/**
 * Stability of a 2-port (ports a → b; S11 = Saa, S21 = Sba, S12 = Sab, S22 = Sbb), with p = S12·S21:
 *   Δ = S11·S22 − p
 *   stability-k (Rollett): K = (1 − |S11|² − |S22|² + |Δ|²) / (2|p|); with |Δ| < 1, K > 1 is the test
 *   stability-mu (Edwards & Sinsky 1992): μ = (1 − |S11|²) / (|S22 − Δ·conj(S11)| + |p|); μ > 1 alone suffices
 *   stability-delta: |Δ|
 * K has no value where p = 0 (no reverse transmission): that is reported, never taken as ∞.
 *
 * Both are computed in forms without cancellation. Written as above, K's numerator and μ's
 * S22 − Δ·conj(S11) subtract numbers of order 1 to leave one of order |p|: on a lossless filter's
 * stopband (|S11| = |S22| = 1, |S21| ≈ 4e-10, |p| ≈ 1.6e-19) that leaves rounding noise, and K came
 * out −5.1 where it is 1. Expanding |Δ|² = |S11|²|S22|² + |p|² − 2·Re(S11·S22·conj(p)) gives
 *   K = ((1 − |S11|²)(1 − |S22|²) + |p|² − 2·Re(S11·S22·conj(p))) / (2|p|),
 * every term of which is computed to its own relative precision (the same algebra as the usual
 * textbook form; Rollett 1962, Edwards & Sinsky 1992), and substituting Δ gives
 *   S22 − Δ·conj(S11) = S22·(1 − |S11|²) + p·conj(S11).
 * What is left in μ is its numerator 1 − |S11|², which the data resolve only to about 1e-16 when
 * |S11| is 1: where |p| is that small, μ itself is not determined by the data.
 */
import { entry } from '../network/network.js';
import { formatFrequency } from '../format/units.js';
import type { FigureContext, FigureDef, Item } from './types.js';

interface Four {
  s11r: Float64Array;
  s11i: Float64Array;
  s21r: Float64Array;
  s21i: Float64Array;
  s12r: Float64Array;
  s12i: Float64Array;
  s22r: Float64Array;
  s22i: Float64Array;
}

function four(ctx: FigureContext, item: Item): Four {
  const [p11, p21, p12, p22] = item.params;
  const g = (p: (typeof item.params)[number]) => entry(ctx.network, p.to, p.from);
  const a = g(p11),
    b = g(p21),
    c = g(p12),
    d = g(p22);
  return { s11r: a.re, s11i: a.im, s21r: b.re, s21i: b.im, s12r: c.re, s12i: c.im, s22r: d.re, s22i: d.im };
}

/** K at point k: NaN where p = S12·S21 = 0. */
function kAt(v: Four, k: number): number {
  const pr = v.s12r[k] * v.s21r[k] - v.s12i[k] * v.s21i[k];
  const pi = v.s12r[k] * v.s21i[k] + v.s12i[k] * v.s21r[k];
  const p = Math.hypot(pr, pi);
  if (p === 0) return NaN;
  // q = S11·S22; Re(q·conj(p))
  const qr = v.s11r[k] * v.s22r[k] - v.s11i[k] * v.s22i[k];
  const qi = v.s11r[k] * v.s22i[k] + v.s11i[k] * v.s22r[k];
  const a = 1 - (v.s11r[k] ** 2 + v.s11i[k] ** 2);
  const b = 1 - (v.s22r[k] ** 2 + v.s22i[k] ** 2);
  return (a * b + p * p - 2 * (qr * pr + qi * pi)) / (2 * p);
}

/** μ at point k: NaN where its denominator vanishes. */
function muAt(v: Four, k: number): number {
  const pr = v.s12r[k] * v.s21r[k] - v.s12i[k] * v.s21i[k];
  const pi = v.s12r[k] * v.s21i[k] + v.s12i[k] * v.s21r[k];
  const a = 1 - (v.s11r[k] ** 2 + v.s11i[k] ** 2);
  // S22·(1 − |S11|²) + p·conj(S11)
  const xr = v.s22r[k] * a + pr * v.s11r[k] + pi * v.s11i[k];
  const xi = v.s22i[k] * a + pi * v.s11r[k] - pr * v.s11i[k];
  const den = Math.hypot(xr, xi) + Math.hypot(pr, pi);
  return den === 0 ? NaN : a / den;
}

const perPoint =
  (at: (v: Four, k: number) => number) =>
  (ctx: FigureContext, item: Item): Float64Array => {
    const v = four(ctx, item);
    return Float64Array.from({ length: v.s11r.length }, (_, k) => at(v, k));
  };

const pointOf = (ctx: FigureContext, hz: number) => Math.max(0, ctx.network.freqHz.indexOf(hz));

export const STABILITY_FIGURES: readonly FigureDef[] = [
  {
    id: 'stability-k',
    title: 'Stability factor K',
    unit: '',
    operands: 'port-pair',
    shape: 'trace',
    worse: 'lower',
    definition: 'Rollett: (1 − |S11|² − |S22|² + |Δ|²)/(2|S12·S21|), Δ = S11·S22 − S12·S21',
    undefinedWhere: 'S12·S21 = 0 (no reverse transmission), where K has no value',
    whyUndefined: (ctx, item, hz) => {
      const mu = muAt(four(ctx, item), pointOf(ctx, hz));
      return `S12·S21 = 0 at ${formatFrequency(hz)} (no reverse transmission), where K has no value; ${Number.isNaN(mu) ? 'stability-mu has none there either (|S11| = 1 or S22 = 0 as well)' : `stability-mu is defined there (μ = ${Number(mu.toPrecision(4))})`}`;
    },
    perPoint: perPoint(kAt),
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
    perPoint: perPoint(muAt),
  },
  {
    id: 'stability-delta',
    title: 'Stability |Δ|',
    unit: '',
    operands: 'port-pair',
    shape: 'trace',
    worse: 'higher',
    definition: '|Δ| = |S11·S22 − S12·S21| (with K > 1, |Δ| < 1 completes the Rollett test)',
    perPoint: perPoint((v, k) => {
      // Δ = S11·S22 − S12·S21
      const dr = v.s11r[k] * v.s22r[k] - v.s11i[k] * v.s22i[k] - (v.s12r[k] * v.s21r[k] - v.s12i[k] * v.s21i[k]);
      const di = v.s11r[k] * v.s22i[k] + v.s11i[k] * v.s22r[k] - (v.s12r[k] * v.s21i[k] + v.s12i[k] * v.s21r[k]);
      return Math.hypot(dr, di);
    }),
  },
];
