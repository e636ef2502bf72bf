/**
 * Data-quality checks of measured S-parameters.
 *
 * Passivity: a passive network absorbs or passes on power but never adds it,
 * which holds exactly when the largest singular value of S is ≤ 1 at every
 * frequency. Active parts (amplifiers) are not expected to pass; callers say
 * whether the check applies.
 * Reciprocity: a network of linear isotropic materials has S = Sᵀ; the
 * figure is the largest |Sij − Sji| over all pairs and frequencies.
 */
import { spectralNorm } from './linalg.js';
import type { Network } from './network.js';

export interface PassivityResult {
  /** Largest singular value of S at each frequency. */
  readonly perFrequency: Float64Array;
  readonly max: number;
  readonly atHz: number;
  /** max ≤ 1 + tolerance. */
  readonly passive: boolean;
}

/**
 * Slack when calling measured data passive: σmax ≤ 1 + 1e-3 (0.0087 dB), the
 * order of a network analyser's trace noise and calibration residue on a
 * near-lossless reflection. Smaller excursions say nothing about the part.
 */
export const PASSIVITY_TOLERANCE = 1e-3;

export function passivity(net: Network, tolerance = PASSIVITY_TOLERANCE): PassivityResult {
  const n = net.ports;
  const k = net.freqHz.length;
  const per = new Float64Array(k);
  const work = new Float64Array(2 * n * n);
  let max = -Infinity,
    at = NaN;
  for (let q = 0; q < k; q++) {
    const v = spectralNorm(net.s, 2 * n * n * q, n, work);
    per[q] = v;
    if (v > max) {
      max = v;
      at = net.freqHz[q];
    }
  }
  return { perFrequency: per, max, atHz: at, passive: max <= 1 + tolerance };
}

export interface ReciprocityResult {
  /** Largest |Sij − Sji|; 0 for a 1-port (always reciprocal). */
  readonly maxDeviation: number;
  readonly atHz: number;
  /** The pair where it sits, 1-based [i, j] with i > j; null for a 1-port. */
  readonly pair: readonly [number, number] | null;
  readonly reciprocal: boolean;
}

/**
 * Slack when calling measured data reciprocal: |Sij − Sji| ≤ 1e-3 (−60 dB),
 * above the noise floor of two independently measured transmission traces and
 * far below the ≈ 1 of a circulator or isolator.
 */
export const RECIPROCITY_TOLERANCE = 1e-3;

export function reciprocity(net: Network, tolerance = RECIPROCITY_TOLERANCE): ReciprocityResult {
  const n = net.ports;
  const k = net.freqHz.length;
  let max = 0,
    at = n > 1 && k > 0 ? net.freqHz[0] : NaN;
  let pair: [number, number] | null = n > 1 ? [2, 1] : null;
  for (let q = 0; q < k; q++) {
    const off = 2 * n * n * q;
    for (let i = 0; i < n; i++) {
      for (let j = 0; j < i; j++) {
        const a = off + 2 * (i * n + j),
          b = off + 2 * (j * n + i);
        const d = Math.hypot(net.s[a] - net.s[b], net.s[a + 1] - net.s[b + 1]);
        if (d > max) {
          max = d;
          at = net.freqHz[q];
          pair = [i + 1, j + 1];
        }
      }
    }
  }
  return { maxDeviation: max, atHz: at, pair, reciprocal: max <= tolerance };
}
