/**
 * 2-port representations: ABCD (chain), T (scattering transfer) and the
 * hybrid H and inverse-hybrid G matrices, plus cascading.
 *
 * Formulas for real, possibly unequal references Z01, Z02 follow D. A. Frickey,
 * "Conversions between S, Z, Y, h, ABCD, and T parameters which are valid for
 * complex source and load impedances", IEEE Trans. MTT 42(2), 1994 (from
 * memory; each is checked in the tests against the route through Z).
 *
 * T convention: [b1; a1] = T · [a2; b2], so that cascading is T_A · T_B:
 *   T11 = −ΔS/S21, T12 = S11/S21, T21 = −S22/S21, T22 = 1/S21.
 */
import { add, at, c, div, mul, put, scale, sub, ONE, type C } from './complex.js';
import { makeNetwork, type Network } from './network.js';
import { renormalize } from './convert.js';

export interface TwoPortMatrices {
  readonly kind: 'ABCD' | 'T' | 'H' | 'G';
  readonly freqHz: Float64Array;
  /** 2×2 complex matrices, same layout as Network.s with n = 2. */
  readonly data: Float64Array;
}

function requireTwoPort(net: Network, what: string): void {
  if (net.ports !== 2) throw new RangeError(`${what} is defined for 2-ports only; this network has ${net.ports} ports`);
}

type Map2 = (m11: C, m12: C, m21: C, m22: C) => [C, C, C, C];

function mapEach(src: Float64Array, f: Map2): Float64Array {
  const out = new Float64Array(src.length);
  for (let off = 0; off < src.length; off += 8) {
    const r = f(at(src, off, 2, 0, 0), at(src, off, 2, 0, 1), at(src, off, 2, 1, 0), at(src, off, 2, 1, 1));
    put(out, off, 2, 0, 0, r[0]);
    put(out, off, 2, 0, 1, r[1]);
    put(out, off, 2, 1, 0, r[2]);
    put(out, off, 2, 1, 1, r[3]);
  }
  return out;
}

export function sToAbcd(net: Network): TwoPortMatrices {
  requireTwoPort(net, 'ABCD');
  const z1 = net.z0[0],
    z2 = net.z0[1];
  const k = 1 / (2 * Math.sqrt(z1 * z2));
  const data = mapEach(net.s, (s11, s12, s21, s22) => {
    const p = mul(s12, s21);
    const den = scale(s21, 1 / k);
    const a = div(add(mul(c(z1 + s11.re * z1, s11.im * z1), sub(ONE, s22)), scale(p, z1)), den);
    const b = div(sub(mul(c(z1 + s11.re * z1, s11.im * z1), c(z2 + s22.re * z2, s22.im * z2)), scale(p, z1 * z2)), den);
    const cc = div(sub(mul(sub(ONE, s11), sub(ONE, s22)), p), den);
    const d = div(add(mul(sub(ONE, s11), c(z2 + s22.re * z2, s22.im * z2)), scale(p, z2)), den);
    return [a, b, cc, d];
  });
  return { kind: 'ABCD', freqHz: net.freqHz, data };
}

export function abcdToS(m: TwoPortMatrices, z0: readonly [number, number] = [50, 50]): Network {
  if (m.kind !== 'ABCD') throw new TypeError(`abcdToS needs ABCD matrices, got ${m.kind}`);
  const [z1, z2] = z0;
  const r = 2 * Math.sqrt(z1 * z2);
  const s = mapEach(m.data, (a, b, cc, d) => {
    const den = add(add(scale(a, z2), b), add(scale(cc, z1 * z2), scale(d, z1)));
    const s11 = div(sub(add(scale(a, z2), b), add(scale(cc, z1 * z2), scale(d, z1))), den);
    const s12 = div(scale(sub(mul(a, d), mul(b, cc)), r), den);
    const s21 = div(c(r), den);
    const s22 = div(add(sub(b, scale(a, z2)), sub(scale(d, z1), scale(cc, z1 * z2))), den);
    return [s11, s12, s21, s22];
  });
  return makeNetwork(m.freqHz, Float64Array.from(z0), s, 2);
}

export function sToT(net: Network): TwoPortMatrices {
  requireTwoPort(net, 'T');
  const data = mapEach(net.s, (s11, s12, s21, s22) => {
    const det = sub(mul(s11, s22), mul(s12, s21));
    return [div(scale(det, -1), s21), div(s11, s21), div(scale(s22, -1), s21), div(ONE, s21)];
  });
  return { kind: 'T', freqHz: net.freqHz, data };
}

export function tToS(m: TwoPortMatrices, z0: readonly [number, number] = [50, 50]): Network {
  if (m.kind !== 'T') throw new TypeError(`tToS needs T matrices, got ${m.kind}`);
  const s = mapEach(m.data, (t11, t12, t21, t22) => {
    const det = sub(mul(t11, t22), mul(t12, t21));
    return [div(t12, t22), div(det, t22), div(ONE, t22), div(scale(t21, -1), t22)];
  });
  return makeNetwork(m.freqHz, Float64Array.from(z0), s, 2);
}

/**
 * Connects port 2 of `a` to port 1 of `b`. Both must share one frequency grid.
 * If the references at the junction differ, `b` is first renormalized so that
 * its port 1 matches `a`'s port 2 (the physics of the joint does not change).
 */
export function cascade(a: Network, b: Network): Network {
  requireTwoPort(a, 'cascade');
  requireTwoPort(b, 'cascade');
  if (a.freqHz.length !== b.freqHz.length || a.freqHz.some((f, k) => f !== b.freqHz[k])) {
    throw new RangeError('cascade: the two networks must share one frequency grid (interpolate one of them first)');
  }
  const bb = b.z0[0] === a.z0[1] ? b : renormalize(b, Float64Array.of(a.z0[1], b.z0[1]));
  const ta = sToT(a),
    tb = sToT(bb);
  const prod = new Float64Array(ta.data.length);
  for (let off = 0; off < prod.length; off += 8) {
    for (let i = 0; i < 2; i++) {
      for (let j = 0; j < 2; j++) {
        put(prod, off, 2, i, j, add(mul(at(ta.data, off, 2, i, 0), at(tb.data, off, 2, 0, j)), mul(at(ta.data, off, 2, i, 1), at(tb.data, off, 2, 1, j))));
      }
    }
  }
  return tToS({ kind: 'T', freqHz: a.freqHz, data: prod }, [a.z0[0], bb.z0[1]]);
}

/**
 * Normalized hybrid parameters → S at unit reference (Frickey 1994, Z0 = 1):
 *   Δ = (1 + h11)(1 + h22) − h12·h21
 *   S11 = ((h11 − 1)(h22 + 1) − h12·h21)/Δ   S12 = 2·h12/Δ
 *   S21 = −2·h21/Δ                           S22 = ((1 + h11)(1 − h22) + h12·h21)/Δ
 * Overwrites `data` (2×2 matrices).
 */
export function hNormalizedToSInPlace(data: Float64Array): Float64Array {
  const out = mapEach(data, hToSUnit);
  data.set(out);
  return data;
}

function hToSUnit(h11: C, h12: C, h21: C, h22: C): [C, C, C, C] {
  const p = mul(h12, h21);
  const den = sub(mul(add(ONE, h11), add(ONE, h22)), p);
  return [
    div(sub(mul(sub(h11, ONE), add(h22, ONE)), p), den),
    div(scale(h12, 2), den),
    div(scale(h21, -2), den),
    div(add(mul(add(ONE, h11), sub(ONE, h22)), p), den),
  ];
}

/** Inverse of a 2×2 complex matrix, element-wise formula. */
function inv2(m11: C, m12: C, m21: C, m22: C): [C, C, C, C] {
  const det = sub(mul(m11, m22), mul(m12, m21));
  return [div(m22, det), div(scale(m12, -1), det), div(scale(m21, -1), det), div(m11, det)];
}

/** Normalized inverse-hybrid G = H⁻¹ → S at unit reference. Overwrites `data`. */
export function gNormalizedToSInPlace(data: Float64Array): Float64Array {
  const out = mapEach(data, (g11, g12, g21, g22) => {
    const h = inv2(g11, g12, g21, g22);
    return hToSUnit(h[0], h[1], h[2], h[3]);
  });
  data.set(out);
  return data;
}

/**
 * S at unit reference → normalized H (Frickey 1994, Z0 = 1):
 *   Δ′ = (1 − S11)(1 + S22) + S12·S21
 *   h11 = ((1 + S11)(1 + S22) − S12·S21)/Δ′   h12 = 2·S12/Δ′
 *   h21 = −2·S21/Δ′                           h22 = ((1 − S11)(1 − S22) − S12·S21)/Δ′
 */
export function sToHNormalized(s: Float64Array): Float64Array {
  return mapEach(s, sToHUnit);
}

function sToHUnit(s11: C, s12: C, s21: C, s22: C): [C, C, C, C] {
  const p = mul(s12, s21);
  const den = add(mul(sub(ONE, s11), add(ONE, s22)), p);
  return [
    div(sub(mul(add(ONE, s11), add(ONE, s22)), p), den),
    div(scale(s12, 2), den),
    div(scale(s21, -2), den),
    div(sub(mul(sub(ONE, s11), sub(ONE, s22)), p), den),
  ];
}

/** S at unit reference → normalized G. */
export function sToGNormalized(s: Float64Array): Float64Array {
  return mapEach(s, (s11, s12, s21, s22) => {
    const h = sToHUnit(s11, s12, s21, s22);
    return inv2(h[0], h[1], h[2], h[3]);
  });
}

/**
 * Per-element scale factors that take absolute H (or G) values to the
 * normalized ones for references R1, R2, derived from v = V/√R, i = I·√R:
 *   h11 = H11/R1, h12 = H12·√(R2/R1), h21 = H21·√(R2/R1), h22 = H22·R2
 *   g11 = G11·R1, g12 = G12·√(R1/R2), g21 = G21·√(R1/R2), g22 = G22/R2
 * For R1 = R2 = R this is Touchstone 1.1's rule (h11 = H11/R, h22 = H22·R).
 */
export function hybridNormalization(kind: 'H' | 'G', r1: number, r2: number): [number, number, number, number] {
  const q = Math.sqrt(r2 / r1);
  return kind === 'H' ? [1 / r1, q, q, r2] : [r1, 1 / q, 1 / q, 1 / r2];
}
