/**
 * Per-frequency derived traces of one complex entry. All take and return
 * Float64Array; none allocates per point.
 *
 * Definitions (a microwave engineering handbook such as Pozar's, common practice):
 *   dB              20·log10|x|
 *   return loss     −20·log10|Γ|
 *   insertion loss  −20·log10|S21|
 *   VSWR            (1 + |Γ|) / (1 − |Γ|)   (Infinity for |Γ| ≥ 1)
 *   mismatch loss   −10·log10(1 − |Γ|²)     (Infinity for |Γ| ≥ 1)
 *   group delay     τ = −dφ/dω on the unwrapped phase, with the real Δf
 */
import type { ComplexTrace } from './network.js';

export function magnitude(t: ComplexTrace): Float64Array {
  const out = new Float64Array(t.re.length);
  for (let k = 0; k < out.length; k++) out[k] = Math.hypot(t.re[k], t.im[k]);
  return out;
}

/** 20·log10|x|. */
export function db(t: ComplexTrace): Float64Array {
  const out = new Float64Array(t.re.length);
  for (let k = 0; k < out.length; k++) {
    const re = t.re[k],
      im = t.im[k];
    out[k] = 10 * Math.log10(re * re + im * im);
  }
  return out;
}

/** −20·log10|x|: return loss of a reflection, insertion loss of a transmission. */
export function lossDb(t: ComplexTrace): Float64Array {
  const out = db(t);
  for (let k = 0; k < out.length; k++) out[k] = -out[k];
  return out;
}

export function vswr(t: ComplexTrace): Float64Array {
  const out = new Float64Array(t.re.length);
  for (let k = 0; k < out.length; k++) {
    const g = Math.hypot(t.re[k], t.im[k]);
    out[k] = g >= 1 ? Infinity : (1 + g) / (1 - g);
  }
  return out;
}

export function mismatchLoss(t: ComplexTrace): Float64Array {
  const out = new Float64Array(t.re.length);
  for (let k = 0; k < out.length; k++) {
    const g2 = t.re[k] * t.re[k] + t.im[k] * t.im[k];
    out[k] = g2 >= 1 ? Infinity : -10 * Math.log10(1 - g2);
  }
  return out;
}

/** Phase in degrees, wrapped into (−180, 180]. */
export function phaseDeg(t: ComplexTrace): Float64Array {
  const out = new Float64Array(t.re.length);
  for (let k = 0; k < out.length; k++) out[k] = (Math.atan2(t.im[k], t.re[k]) * 180) / Math.PI;
  return out;
}

/**
 * Unwraps a phase sequence in degrees: wherever two neighbours differ by
 * 180° or more, whole turns are added so that the step falls into [−180, 180).
 * This is the rule numpy.unwrap applies (a step of exactly +180° is kept).
 */
export function unwrapDeg(phase: Float64Array): Float64Array {
  const out = new Float64Array(phase.length);
  if (phase.length === 0) return out;
  out[0] = phase[0];
  let correction = 0;
  for (let k = 1; k < phase.length; k++) {
    const d = phase[k] - phase[k - 1];
    if (Math.abs(d) >= 180) {
      let m = mod(d + 180, 360) - 180;
      if (m === -180 && d > 0) m = 180;
      correction += m - d;
    }
    out[k] = phase[k] + correction;
  }
  return out;
}

function mod(a: number, b: number): number {
  const r = a % b;
  return r < 0 ? r + b : r;
}

/** Unwrapped phase in degrees. */
export function phaseUnwrappedDeg(t: ComplexTrace): Float64Array {
  return unwrapDeg(phaseDeg(t));
}

/**
 * Group delay in seconds: τ = −(1/360)·dφ/df, φ the unwrapped phase in degrees.
 * Differences are taken over ±`aperture` points (1 = plain central
 * differences), clamped at the ends so that the first and last points use
 * one-sided differences; Δf is the real frequency step, so non-uniform grids
 * are handled. A single point has no delay (NaN).
 */
export function groupDelay(freqHz: Float64Array, t: ComplexTrace, aperture = 1): Float64Array {
  return groupDelayFromPhase(freqHz, phaseUnwrappedDeg(t), aperture);
}

export function groupDelayFromPhase(freqHz: Float64Array, unwrappedDeg: Float64Array, aperture = 1): Float64Array {
  if (!Number.isInteger(aperture) || aperture < 1) throw new RangeError(`group-delay aperture must be a whole number of points ≥ 1, got ${aperture}`);
  const n = freqHz.length;
  const out = new Float64Array(n);
  if (n < 2) {
    out.fill(NaN);
    return out;
  }
  for (let k = 0; k < n; k++) {
    const lo = Math.max(0, k - aperture);
    const hi = Math.min(n - 1, k + aperture);
    out[k] = -(unwrappedDeg[hi] - unwrappedDeg[lo]) / (360 * (freqHz[hi] - freqHz[lo]));
  }
  return out;
}
