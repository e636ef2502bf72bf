/**
 * Conversions between S, Z and Y matrices, and renormalization of S to new
 * reference impedances. All references are real (Touchstone references are
 * real numbers), so power waves and pseudo-waves coincide.
 *
 * With R = diag(z0) (a microwave engineering handbook, e.g. Pozar §4.3, from memory):
 *   Z = √R (I + S)(I − S)⁻¹ √R          S = (z − I)(z + I)⁻¹,  z = R^−½ Z R^−½
 *   Y = R^−½ (I − S)(I + S)⁻¹ R^−½      S = (I − y)(I + y)⁻¹,  y = √R Y √R
 * A matrix that is singular at some frequency (the Z of an ideal thru, say)
 * gives NaN entries there rather than an exception.
 */
import { cmatInv, cmatMul } from './linalg.js';
import { makeNetwork, type Network } from './network.js';

/** Impedance or admittance matrices at every frequency, in ohms or siemens. */
export interface ParameterMatrices {
  readonly kind: 'Z' | 'Y';
  readonly ports: number;
  readonly freqHz: Float64Array;
  /** Same layout as Network.s. */
  readonly data: Float64Array;
}

/**
 * At every frequency: dst ← (σ·I + a·M)(I + b·M)⁻¹, for σ, a, b ∈ {+1, −1}.
 * (I + a·M) and (I + b·M)⁻¹ commute, so the order of the product is free.
 * dst may be src (the matrix is copied into the workspace first).
 */
function bilinearMap(src: Float64Array, n: number, sigma: number, a: number, b: number, dst: Float64Array): Float64Array {
  const ws = workspace(n);
  const size = 2 * n * n;
  for (let off = 0; off < src.length; off += size) {
    for (let i = 0; i < size; i++) {
      ws.num[i] = a * src[off + i];
      ws.den[i] = b * src[off + i];
    }
    for (let i = 0; i < n; i++) {
      ws.num[2 * (i * n + i)] += sigma;
      ws.den[2 * (i * n + i)] += 1;
    }
    if (!cmatInv(ws.den, 0, n, ws.inv, 0, ws.work)) {
      dst.fill(NaN, off, off + size);
      continue;
    }
    cmatMul(ws.num, 0, ws.inv, 0, n, dst, off);
  }
  return dst;
}

interface Workspace {
  num: Float64Array;
  den: Float64Array;
  inv: Float64Array;
  work: Float64Array;
}

function workspace(n: number): Workspace {
  const size = 2 * n * n;
  return { num: new Float64Array(size), den: new Float64Array(size), inv: new Float64Array(size), work: new Float64Array(size) };
}

/** Scales element (i, j) of every matrix by w[i]·w[j]. */
function scaleSymmetric(data: Float64Array, n: number, w: Float64Array): void {
  const size = 2 * n * n;
  for (let off = 0; off < data.length; off += size) {
    for (let i = 0; i < n; i++) {
      for (let j = 0; j < n; j++) {
        const p = off + 2 * (i * n + j);
        const f = w[i] * w[j];
        data[p] *= f;
        data[p + 1] *= f;
      }
    }
  }
}

export function sToZ(net: Network): ParameterMatrices {
  const n = net.ports;
  const data = bilinearMap(net.s, n, +1, +1, -1, new Float64Array(net.s.length));
  scaleSymmetric(data, n, net.z0.map(Math.sqrt));
  return { kind: 'Z', ports: n, freqHz: net.freqHz, data };
}

export function sToY(net: Network): ParameterMatrices {
  const n = net.ports;
  const data = bilinearMap(net.s, n, +1, -1, +1, new Float64Array(net.s.length));
  scaleSymmetric(
    data,
    n,
    net.z0.map((r) => 1 / Math.sqrt(r)),
  );
  return { kind: 'Y', ports: n, freqHz: net.freqHz, data };
}

/** S from Z (ohms) at the given reference impedances. */
export function zToS(freqHz: Float64Array, z: Float64Array, z0: Float64Array): Network {
  const n = z0.length;
  const norm = z.slice();
  scaleSymmetric(
    norm,
    n,
    z0.map((r) => 1 / Math.sqrt(r)),
  );
  return makeNetwork(freqHz, z0, zNormalizedToSInPlace(norm, n), n);
}

/** S from Y (siemens) at the given reference impedances. */
export function yToS(freqHz: Float64Array, y: Float64Array, z0: Float64Array): Network {
  const n = z0.length;
  const norm = y.slice();
  scaleSymmetric(norm, n, z0.map(Math.sqrt));
  return makeNetwork(freqHz, z0, yNormalizedToSInPlace(norm, n), n);
}

/** Normalized z → S, overwriting the array (used by the Touchstone reader). */
export function zNormalizedToSInPlace(data: Float64Array, n: number): Float64Array {
  return bilinearMap(data, n, -1, +1, +1, data);
}

/** Normalized y → S, overwriting the array. */
export function yNormalizedToSInPlace(data: Float64Array, n: number): Float64Array {
  return bilinearMap(data, n, +1, -1, +1, data);
}

/**
 * Renormalizes S to new real reference impedances:
 *   S′ = A⁻¹ (S − Γ)(I − Γ S)⁻¹ A,
 *   Γi = (R′i − Ri)/(R′i + Ri),  Ai = 2√(Ri R′i)/(Ri + R′i)
 * (the generalized-scattering result, e.g. Kurokawa 1965; checked in the tests
 * against the route through Z). Works where Z does not exist (an ideal thru).
 */
export function renormalize(net: Network, z0New: Float64Array | number): Network {
  const n = net.ports;
  const target = typeof z0New === 'number' ? new Float64Array(n).fill(z0New) : z0New;
  if (target.length !== n) throw new RangeError(`renormalize: expected ${n} reference impedances, got ${target.length}`);
  for (const r of target) if (!(r > 0) || !Number.isFinite(r)) throw new RangeError(`renormalize: reference impedances must be positive and finite, got ${r}`);
  const gamma = new Float64Array(n);
  const a = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    const r = net.z0[i],
      rn = target[i];
    gamma[i] = (rn - r) / (rn + r);
    a[i] = (2 * Math.sqrt(r * rn)) / (r + rn);
  }
  const size = 2 * n * n;
  const out = new Float64Array(net.s.length);
  const ws = workspace(n);
  const prod = new Float64Array(size);
  for (let off = 0; off < net.s.length; off += size) {
    for (let i = 0; i < n; i++) {
      for (let j = 0; j < n; j++) {
        const p = 2 * (i * n + j);
        const sr = net.s[off + p],
          si = net.s[off + p + 1];
        ws.num[p] = sr - (i === j ? gamma[i] : 0);
        ws.num[p + 1] = si;
        ws.den[p] = (i === j ? 1 : 0) - gamma[i] * sr;
        ws.den[p + 1] = -gamma[i] * si;
      }
    }
    if (!cmatInv(ws.den, 0, n, ws.inv, 0, ws.work)) {
      out.fill(NaN, off, off + size);
      continue;
    }
    cmatMul(ws.num, 0, ws.inv, 0, n, prod, 0);
    for (let i = 0; i < n; i++) {
      for (let j = 0; j < n; j++) {
        const p = 2 * (i * n + j);
        const f = a[j] / a[i];
        out[off + p] = prod[p] * f;
        out[off + p + 1] = prod[p + 1] * f;
      }
    }
  }
  return makeNetwork(net.freqHz, Float64Array.from(target), out, n);
}
