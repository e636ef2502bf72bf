/**
 * Traces of candidates on one another's grids, never extrapolated.
 *
 * A candidate's trace is the median of its units' traces at each point of its
 * first unit's grid, each other unit linearly interpolated there where its
 * own grid reaches (units whose grid does not reach a point are left out of
 * that point's median). A difference trace is candidate minus baseline on the
 * common grid: every point of either trace inside the overlap of both grids
 * and the band (the overlap's ends included), each trace linear in the
 * figure's value between its own points — numpy's interp on the same values.
 */
import { interpolateAt } from '../network/interpolate.js';
import type { Trace } from './trace.js';

/** The median of the traces at each point of the first one's grid; the points no trace reaches are left out. */
export function medianTrace(traces: readonly Trace[]): Trace {
  if (!traces.length) return { freqHz: new Float64Array(0), values: new Float64Array(0) };
  const grid = traces[0].freqHz;
  const f: number[] = [],
    v: number[] = [];
  const column = new Float64Array(traces.length);
  for (let k = 0; k < grid.length; k++) {
    const x = grid[k];
    let n = 0;
    for (const t of traces) {
      const g = t.freqHz;
      if (x < g[0] || x > g[g.length - 1]) continue;
      const y = interpolateAt(g, t.values, x);
      if (Number.isFinite(y)) column[n++] = y;
    }
    if (!n) continue;
    const sorted = column.subarray(0, n).sort();
    f.push(x);
    v.push(n % 2 ? sorted[(n - 1) / 2] : (sorted[n / 2 - 1] + sorted[n / 2]) / 2);
  }
  return { freqHz: Float64Array.from(f), values: Float64Array.from(v) };
}

/** Every point of a and b inside [from, to] ∩ both grids, with that interval's ends, ascending and once each; empty when they do not overlap. */
export function commonGrid(a: Float64Array, b: Float64Array, fromHz: number, toHz: number): Float64Array {
  if (!a.length || !b.length) return new Float64Array(0);
  const lo = Math.max(a[0], b[0], fromHz),
    hi = Math.min(a[a.length - 1], b[b.length - 1], toHz);
  if (!(lo <= hi)) return new Float64Array(0);
  const out: number[] = [lo];
  let i = 0,
    j = 0;
  while (i < a.length && a[i] <= lo) i++;
  while (j < b.length && b[j] <= lo) j++;
  // merge the two ascending grids strictly between lo and hi
  for (;;) {
    const x = Math.min(i < a.length ? a[i] : Infinity, j < b.length ? b[j] : Infinity);
    if (!(x < hi)) break;
    out.push(x);
    while (i < a.length && a[i] <= x) i++;
    while (j < b.length && b[j] <= x) j++;
  }
  if (hi > lo) out.push(hi);
  return Float64Array.from(out);
}

/** candidate − baseline on their common grid over [from, to]; NaN where either trace is. */
export function differenceTrace(candidate: Trace, baseline: Trace, fromHz: number, toHz: number): Trace {
  const grid = commonGrid(candidate.freqHz, baseline.freqHz, fromHz, toHz);
  const values = new Float64Array(grid.length);
  for (let k = 0; k < grid.length; k++)
    values[k] = interpolateAt(candidate.freqHz, candidate.values, grid[k]) - interpolateAt(baseline.freqHz, baseline.values, grid[k]);
  return { freqHz: grid, values };
}
