/**
 * Interpolation of a network onto another frequency grid.
 *
 * Method: per entry, the magnitude and the unwrapped phase are each
 * interpolated linearly in frequency ("polar"). For the electrically long
 * parts this tool documents (cables, filters with many degrees of phase per
 * step), linear interpolation of the real and imaginary parts would cut the
 * chord of the phasor's rotation and report a loss dip between points; polar
 * interpolation keeps |S| and the group delay between two measured points.
 * `method: 'rectangular'` (linear in re/im) is offered for comparison with
 * tools that use it.
 *
 * It never extrapolates: a target frequency outside the measured range is an
 * error.
 */
import { makeNetwork, type Network } from './network.js';
import { unwrapDeg } from './traces.js';

export type InterpolationMethod = 'polar' | 'rectangular';

export class ExtrapolationError extends RangeError {}

/** Index i with x[i] ≤ f ≤ x[i+1] (x ascending), by bisection. */
export function bracket(x: Float64Array, f: number): number {
  let lo = 0,
    hi = x.length - 1;
  while (hi - lo > 1) {
    const mid = (lo + hi) >> 1;
    if (x[mid] <= f) lo = mid;
    else hi = mid;
  }
  return lo;
}

/** Linear interpolation of y(x) at f (x ascending, f inside the range). */
export function interpolateAt(x: Float64Array, y: Float64Array, f: number): number {
  if (x.length === 1) return y[0];
  const i = bracket(x, f);
  if (f === x[i]) return y[i];
  if (f === x[i + 1]) return y[i + 1];
  const t = (f - x[i]) / (x[i + 1] - x[i]);
  const a = y[i],
    b = y[i + 1];
  // strictly between a finite value and ±∞ the line is ±∞ (its limit), not ∞·0 or ∞ − ∞ = NaN
  if (!Number.isFinite(a) || !Number.isFinite(b)) return Number.isFinite(a) ? b : Number.isFinite(b) || a === b ? a : NaN;
  return a + t * (b - a);
}

export function interpolate(net: Network, freqHz: Float64Array, method: InterpolationMethod = 'polar'): Network {
  const src = net.freqHz;
  const k = src.length;
  if (k === 0) throw new ExtrapolationError('cannot interpolate a network with no frequency points');
  const f0 = src[0],
    f1 = src[k - 1];
  for (let q = 0; q < freqHz.length; q++) {
    const f = freqHz[q];
    if (!(f >= f0 && f <= f1)) {
      throw new ExtrapolationError(`cannot interpolate to ${f} Hz: the data cover ${f0} Hz to ${f1} Hz and scatterbook does not extrapolate`);
    }
    if (q > 0 && !(f > freqHz[q - 1])) throw new RangeError('the target frequencies must increase strictly');
  }
  const n = net.ports;
  const nn = n * n;
  const out = new Float64Array(freqHz.length * nn * 2);
  const a = new Float64Array(k);
  const b = new Float64Array(k);
  const idx = new Int32Array(freqHz.length);
  for (let q = 0; q < freqHz.length; q++) idx[q] = k === 1 ? 0 : bracket(src, freqHz[q]);
  for (let e = 0; e < nn; e++) {
    for (let p = 0; p < k; p++) {
      const re = net.s[2 * (p * nn + e)],
        im = net.s[2 * (p * nn + e) + 1];
      if (method === 'polar') {
        a[p] = Math.hypot(re, im);
        b[p] = (Math.atan2(im, re) * 180) / Math.PI;
      } else {
        a[p] = re;
        b[p] = im;
      }
    }
    const bb = method === 'polar' ? unwrapDeg(b) : b;
    for (let q = 0; q < freqHz.length; q++) {
      const i = idx[q];
      const f = freqHz[q];
      let va: number, vb: number;
      if (k === 1 || f === src[i]) {
        va = a[i];
        vb = bb[i];
      } else {
        const t = (f - src[i]) / (src[i + 1] - src[i]);
        va = a[i] + t * (a[i + 1] - a[i]);
        vb = bb[i] + t * (bb[i + 1] - bb[i]);
      }
      const o = 2 * (q * nn + e);
      if (method === 'polar') {
        const r = (vb * Math.PI) / 180;
        out[o] = va * Math.cos(r);
        out[o + 1] = va * Math.sin(r);
      } else {
        out[o] = va;
        out[o + 1] = vb;
      }
    }
  }
  return makeNetwork(Float64Array.from(freqHz), net.z0, out, n);
}
