/**
 * Frequency-domain quality metrics of IEEE Std 370-2020 (§ on S-parameter
 * quality), as its open reference code computes them:
 *
 * Passivity: PM_k = largest singular value of S at frequency k;
 *   PW_k = (PM_k − 1.00001)/0.1 where PM_k > 1.00001, else 0;
 *   PQM = max(N − ΣPW, 0)/N × 100.
 * Reciprocity: RM_k = Σ|Sij − Sji| / (P(P − 1)) over all i ≠ j;
 *   RW_k = (RM_k − 1e−6)/0.1 where RM_k > 1e−6; RQM as PQM.
 * Causality: for each entry Sij, V_k = S(k+1) − S(k),
 *   R_k = Re(V_k+1)·Im(V_k) − Im(V_k+1)·Re(V_k) (positive when the trace turns
 *   clockwise, as a causal response does with rising frequency);
 *   CQM_ij = Σ(positive R)/Σ|R| × 100, and CQM is the minimum over ij.
 * Grades: passivity and reciprocity Good > 99.9, Acceptable > 99,
 *   Inconclusive > 80, else Poor; causality Good > 80, Acceptable > 50,
 *   Inconclusive > 20, else Poor.
 *
 * Reciprocity has no meaning for a 1-port (P(P − 1) = 0): it is reported as
 * null rather than as a perfect score.
 */
import { spectralNorm } from './linalg.js';
import type { Network } from './network.js';

export type Grade = 'Good' | 'Acceptable' | 'Inconclusive' | 'Poor';

export interface QualityMetric {
  /** 0–100. */
  readonly score: number;
  readonly grade: Grade;
}

export interface Ieee370Quality {
  readonly passivity: QualityMetric;
  readonly reciprocity: QualityMetric | null;
  readonly causality: QualityMetric | null;
}

const PASSIVITY_THRESHOLD = 1.00001;
const RECIPROCITY_THRESHOLD = 1e-6;
const WEIGHT_SCALE = 0.1;

function gradeOf(score: number, bounds: readonly [number, number, number]): Grade {
  if (score > bounds[0]) return 'Good';
  if (score > bounds[1]) return 'Acceptable';
  if (score > bounds[2]) return 'Inconclusive';
  return 'Poor';
}

const PR_BOUNDS = [99.9, 99, 80] as const;
const CAUSALITY_BOUNDS = [80, 50, 20] as const;

function scoreFromWeights(weights: Float64Array): number {
  const n = weights.length;
  let sum = 0;
  for (const w of weights) sum += w;
  return (Math.max(n - sum, 0) / n) * 100;
}

/** `perFrequency`: the largest singular value at each frequency, when the caller has it already (quality.ts). */
export function passivityMetric(net: Network, perFrequency?: Float64Array): QualityMetric {
  const n = net.ports;
  const k = net.freqHz.length;
  const w = new Float64Array(k);
  for (let q = 0; q < k; q++) {
    const pm = perFrequency ? perFrequency[q] : spectralNorm(net.s, 2 * n * n * q, n);
    w[q] = pm > PASSIVITY_THRESHOLD ? (pm - PASSIVITY_THRESHOLD) / WEIGHT_SCALE : 0;
  }
  const score = scoreFromWeights(w);
  return { score, grade: gradeOf(score, PR_BOUNDS) };
}

export function reciprocityMetric(net: Network): QualityMetric | null {
  const n = net.ports;
  if (n < 2) return null;
  const k = net.freqHz.length;
  const w = new Float64Array(k);
  for (let q = 0; q < k; q++) {
    const off = 2 * n * n * q;
    let sum = 0;
    for (let i = 0; i < n; i++) {
      for (let j = 0; j < n; j++) {
        if (i === j) continue;
        const a = off + 2 * (i * n + j),
          b = off + 2 * (j * n + i);
        sum += Math.hypot(net.s[a] - net.s[b], net.s[a + 1] - net.s[b + 1]);
      }
    }
    const rm = sum / (n * (n - 1));
    w[q] = rm > RECIPROCITY_THRESHOLD ? (rm - RECIPROCITY_THRESHOLD) / WEIGHT_SCALE : 0;
  }
  const score = scoreFromWeights(w);
  return { score, grade: gradeOf(score, PR_BOUNDS) };
}

/** Causality score; null when there are fewer than three points (no turn to measure). */
export function causalityMetric(net: Network): QualityMetric | null {
  const n = net.ports;
  const k = net.freqHz.length;
  if (k < 3) return null;
  const stride = 2 * n * n;
  let worst = Infinity;
  for (let e = 0; e < n * n; e++) {
    let pos = 0,
      total = 0;
    for (let q = 0; q + 2 < k; q++) {
      const p0 = 2 * e + q * stride,
        p1 = p0 + stride,
        p2 = p1 + stride;
      const vr = net.s[p1] - net.s[p0],
        vi = net.s[p1 + 1] - net.s[p0 + 1];
      const wr = net.s[p2] - net.s[p1],
        wi = net.s[p2 + 1] - net.s[p1 + 1];
      const r = wr * vi - wi * vr;
      if (r > 0) pos += r;
      total += Math.abs(r);
    }
    // An entry that never turns (a constant or a straight line) gives no evidence either way.
    const cqm = total === 0 ? 100 : (pos / total) * 100;
    if (cqm < worst) worst = cqm;
  }
  return { score: worst, grade: gradeOf(worst, CAUSALITY_BOUNDS) };
}

export function ieee370Quality(net: Network, passivityPerFrequency?: Float64Array): Ieee370Quality {
  return { passivity: passivityMetric(net, passivityPerFrequency), reciprocity: reciprocityMetric(net), causality: causalityMetric(net) };
}
