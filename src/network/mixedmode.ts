/**
 * Single-ended to mixed-mode S-parameters (Bockelman & Eisenstadt, IEEE Trans.
 * MTT 43(7), 1995).
 *
 * The pairing is explicit: `pairs` lists, for each mixed-mode port m, the
 * single-ended ports [p, n] that form it (1-based). The differential wave is
 * (a_p − a_n)/√2 and the common wave (a_p + a_n)/√2. The result is a 2M-port
 * ordered D1…DM, C1…CM, so its matrix reads [[Sdd, Sdc], [Scd, Scc]].
 *
 * Reference impedances: differential = R_p + R_n (2R for equal legs), common =
 * R_p·R_n/(R_p + R_n) (R/2) — Touchstone 2.0's [Mixed-Mode Order] rule.
 * Legs of one pair must share a reference: the transform is exact only then.
 *
 * With pairs [[1,2],[3,4]] (the default), through paths 1→3 and 2→4:
 *   Sdd21 = ½(S31 − S32 − S41 + S42), Scc21 = ½(S31 + S32 + S41 + S42),
 *   Sdc21 = ½(S31 + S32 − S41 − S42), Scd21 = ½(S31 − S32 + S41 − S42).
 * The other common numbering, pairs [[1,3],[2,4]], is one argument away.
 */
import { makeNetwork, type Network } from './network.js';

export type PortPairs = ReadonlyArray<readonly [number, number]>;

/** Pairs (1,2) and (3,4): ports 1, 2 form the first differential port. */
export const PAIRS_ADJACENT: PortPairs = [
  [1, 2],
  [3, 4],
];
/** Pairs (1,3) and (2,4): odd ports positive, the first pair on ports 1 and 3. */
export const PAIRS_ACROSS: PortPairs = [
  [1, 3],
  [2, 4],
];

export interface MixedModeNetwork extends Network {
  /** Port labels in order: D1…DM then C1…CM. */
  readonly modes: readonly string[];
}

export function toMixedMode(net: Network, pairs: PortPairs = PAIRS_ADJACENT): MixedModeNetwork {
  const n = net.ports;
  const m = pairs.length;
  if (2 * m !== n) throw new RangeError(`mixed-mode: ${m} pairs cover ${2 * m} ports, but the network has ${n}`);
  const seen = new Set<number>();
  for (const [p, q] of pairs) {
    for (const x of [p, q]) {
      if (!Number.isInteger(x) || x < 1 || x > n) throw new RangeError(`mixed-mode: port ${x} is not a port of this ${n}-port`);
      if (seen.has(x)) throw new RangeError(`mixed-mode: port ${x} is in two pairs`);
      seen.add(x);
    }
    if (net.z0[p - 1] !== net.z0[q - 1]) {
      throw new RangeError(
        `mixed-mode: ports ${p} and ${q} have different references (${net.z0[p - 1]} Ω, ${net.z0[q - 1]} Ω); renormalize them to one value first`,
      );
    }
  }
  // M (real, orthogonal): row m = differential m, row M + m = common m.
  const M = new Float64Array(n * n);
  const h = Math.SQRT1_2;
  pairs.forEach(([p, q], k) => {
    M[k * n + (p - 1)] = h;
    M[k * n + (q - 1)] = -h;
    M[(m + k) * n + (p - 1)] = h;
    M[(m + k) * n + (q - 1)] = h;
  });
  const size = 2 * n * n;
  const out = new Float64Array(net.s.length);
  const tmp = new Float64Array(size);
  for (let off = 0; off < net.s.length; off += size) {
    // tmp = S · Mᵀ
    for (let i = 0; i < n; i++) {
      for (let j = 0; j < n; j++) {
        let re = 0,
          im = 0;
        for (let k = 0; k < n; k++) {
          const w = M[j * n + k];
          if (w === 0) continue;
          re += net.s[off + 2 * (i * n + k)] * w;
          im += net.s[off + 2 * (i * n + k) + 1] * w;
        }
        tmp[2 * (i * n + j)] = re;
        tmp[2 * (i * n + j) + 1] = im;
      }
    }
    // out = M · tmp
    for (let i = 0; i < n; i++) {
      for (let j = 0; j < n; j++) {
        let re = 0,
          im = 0;
        for (let k = 0; k < n; k++) {
          const w = M[i * n + k];
          if (w === 0) continue;
          re += w * tmp[2 * (k * n + j)];
          im += w * tmp[2 * (k * n + j) + 1];
        }
        out[off + 2 * (i * n + j)] = re;
        out[off + 2 * (i * n + j) + 1] = im;
      }
    }
  }
  const z0 = new Float64Array(n);
  pairs.forEach(([p, q], k) => {
    const rp = net.z0[p - 1],
      rq = net.z0[q - 1];
    z0[k] = rp + rq;
    z0[m + k] = (rp * rq) / (rp + rq);
  });
  const modes = [...pairs.map((_, k) => `D${k + 1}`), ...pairs.map((_, k) => `C${k + 1}`)];
  return Object.freeze({ ...makeNetwork(net.freqHz, z0, out, n), modes });
}

/**
 * One mixed-mode entry by name, e.g. "Sdd21", "Scd11": the mode letters are
 * output mode then input mode, the digits output port then input port.
 */
export function mixedModeIndex(mm: MixedModeNetwork, name: string): [number, number] {
  const match = /^S([dc])([dc])(\d)(\d)$/i.exec(name);
  if (!match) throw new RangeError(`"${name}" is not a mixed-mode parameter name such as Sdd21 or Scd11`);
  const half = mm.ports / 2;
  const [, mo, mi, po, pi] = match;
  const row = (mo.toLowerCase() === 'd' ? 0 : half) + Number(po) - 1;
  const col = (mi.toLowerCase() === 'd' ? 0 : half) + Number(pi) - 1;
  if (Number(po) < 1 || Number(po) > half || Number(pi) < 1 || Number(pi) > half) {
    throw new RangeError(`${name}: this mixed-mode network has ${half} mode ports`);
  }
  return [row + 1, col + 1];
}
