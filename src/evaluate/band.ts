/**
 * The band evaluation set: every measured point with from ≤ f ≤ to, plus the
 * two edges. A value at an edge that is not a measured point is the linear
 * interpolation of the figure's per-point values between the two measured
 * points around it (group delay and the like are computed on the measured
 * grid first, then interpolated).
 */
import { interpolateAt } from '../network/interpolate.js';

export interface BandSet {
  readonly freqHz: Float64Array;
  readonly values: Float64Array;
}

/** Callers check first that [fromHz, toHz] lies inside the measured range. */
export function bandSet(freqHz: Float64Array, values: Float64Array, fromHz: number, toHz: number): BandSet {
  const n = freqHz.length;
  let first = 0;
  while (first < n && freqHz[first] < fromHz) first++;
  let last = n - 1;
  while (last >= 0 && freqHz[last] > toHz) last--;
  const inner = Math.max(0, last - first + 1);
  const lowEdge = inner === 0 || freqHz[first] !== fromHz;
  const highEdge = (inner === 0 || freqHz[last] !== toHz) && toHz !== fromHz;
  const size = inner + (lowEdge ? 1 : 0) + (highEdge ? 1 : 0);
  const f = new Float64Array(size);
  const v = new Float64Array(size);
  let w = 0;
  const at = (x: number) => interpolateAt(freqHz, values, x);
  if (lowEdge) {
    f[w] = fromHz;
    v[w++] = at(fromHz);
  }
  for (let k = first; k <= last; k++) {
    f[w] = freqHz[k];
    v[w++] = values[k];
  }
  if (highEdge) {
    f[w] = toHz;
    v[w++] = at(toHz);
  }
  return { freqHz: f, values: v };
}
