/**
 * A ferrite junction circulator by its eigenvalues, and the isolator made
 * from it by terminating port 3.
 *
 * A symmetric 3-port has the eigenvectors u1 = (1, 1, 1)/√3 and
 * u± = (1, w^±1, w^∓1)/√3, w = e^(j2π/3), and S = Σ λk·uk·ukᴴ. Ideal
 * circulation 1 → 2 → 3 takes λ1 = 1, λ± = w^∓1. The two counter-rotating
 * resonances of the magnetized disc move λ± off those phases away from the
 * centre frequency: here each gains the phase −2·atan(Q·(f/f0 − f0/f)) of a
 * resonator of loaded Q, and losses scale |λ| below 1 (Helszajn, The Stripline
 * Circulator, the eigenvalue picture, from memory). Then the isolator:
 *   S′ij = Sij + Si3·ΓL·S3j/(1 − S33·ΓL), i, j ∈ {1, 2}.
 * Passive (|λ| ≤ 1 and S is normal) and, by design, not reciprocal.
 */
import { add, c, div, mul, sub, ONE, type C } from '../../network/complex.js';
import { makeNetwork, type Network } from '../../network/network.js';
import type { Random } from '../random.js';

export interface CirculatorDesign {
  readonly f0: number;
  readonly q: number;
  readonly loss: number;
  /** |ΓL| of the termination on port 3. */
  readonly loadReflection: number;
  readonly spread: number;
}

function circulatorAt(f: number, f0: number, q: number, loss: number): C[][] {
  const x = q * (f / f0 - f0 / f);
  const detune = -2 * Math.atan(x);
  const w = (k: number) => c(Math.cos((2 * Math.PI * k) / 3), Math.sin((2 * Math.PI * k) / 3));
  const mag = 1 - loss;
  const l1 = c(1 - loss / 4, 0);
  const lp = mul(w(-1), c(mag * Math.cos(detune), mag * Math.sin(detune)));
  const lm = mul(w(1), c(mag * Math.cos(detune), mag * Math.sin(detune)));
  const u = [
    [c(1), c(1), c(1)],
    [c(1), w(1), w(-1)],
    [c(1), w(-1), w(1)],
  ].map((v) => v.map((z) => c(z.re / Math.sqrt(3), z.im / Math.sqrt(3))));
  const lambdas = [l1, lp, lm];
  const s: C[][] = [0, 1, 2].map(() => [c(0), c(0), c(0)]);
  for (let k = 0; k < 3; k++)
    for (let i = 0; i < 3; i++)
      for (let j = 0; j < 3; j++) {
        // λk · u_k[i] · conj(u_k[j])
        const term = mul(lambdas[k], mul(u[k][i], c(u[k][j].re, -u[k][j].im)));
        s[i][j] = add(s[i][j], term);
      }
  return s;
}

export function isolator(d: CirculatorDesign, freqHz: Float64Array, rnd: Random): Network {
  const f0 = d.f0 * (1 + rnd.normal(0, d.spread));
  const q = d.q * (1 + rnd.normal(0, 5 * d.spread));
  const gl = c(d.loadReflection * (1 + rnd.normal(0, 0.2)), 0);
  const out = new Float64Array(freqHz.length * 8);
  freqHz.forEach((f, k) => {
    const s = circulatorAt(f, f0, q, d.loss);
    const den = sub(ONE, mul(s[2][2], gl));
    for (let i = 0; i < 2; i++)
      for (let j = 0; j < 2; j++) {
        const v = add(s[i][j], div(mul(mul(s[i][2], gl), s[2][j]), den));
        out.set([v.re, v.im], 8 * k + 2 * (2 * i + j));
      }
  });
  return makeNetwork(freqHz, 50, out, 2);
}
