/**
 * Distributed parts: a Wilkinson divider and a branch-line hybrid of lossy
 * quarter-wave lines (nodal analysis, nodal.ts), a coupled-line coupler from
 * its even- and odd-mode impedances and permittivities, and a coaxial cable
 * with √f conductor loss, f dielectric loss and connector mismatch.
 * Loss per metre: α(f) = a·√(f/1 GHz) + b·(f/1 GHz) Np/m.
 */
import { add, c, sub, type C } from '../../network/complex.js';
import { makeNetwork, type Network } from '../../network/network.js';
import { chainToNetwork, line, series, shunt } from '../circuit.js';
import { nodalNetwork, resistor, tline } from '../nodal.js';
import type { Random } from '../random.js';

const C0 = 299_792_458;

export const lineLoss = (a: number, b: number) => (omega: number) => {
  const g = omega / (2 * Math.PI * 1e9);
  return a * Math.sqrt(g) + b * g;
};

/** Quarter-wave length at f0 for relative permittivity er. */
const quarterWave = (f0: number, er: number) => C0 / (4 * f0 * Math.sqrt(er));

export interface LineSpread {
  readonly impedance: number;
  readonly length: number;
}

/** 2-way Wilkinson: ports 1 (common), 2, 3; √2·Z0 quarter-wave arms, 2·Z0 resistor. */
export function wilkinson(
  f0: number,
  er: number,
  loss: { a: number; b: number },
  spread: LineSpread & { resistor: number },
  freqHz: Float64Array,
  rnd: Random,
): Network {
  const z = (zn: number) => zn * (1 + rnd.normal(0, spread.impedance));
  const l = () => quarterWave(f0, er) * (1 + rnd.normal(0, spread.length));
  const alpha = lineLoss(loss.a, loss.b);
  return nodalNetwork(
    3,
    [
      tline(0, 1, z(50 * Math.SQRT2), l(), er, alpha),
      tline(0, 2, z(50 * Math.SQRT2), l(), er, alpha),
      resistor(1, 2, 100 * (1 + rnd.normal(0, spread.resistor))),
    ],
    freqHz,
  );
}

/**
 * Branch-line hybrid: port 1 in, 2 through (−90°), 3 coupled (−180°), 4 isolated;
 * Z0/√2 series arms 1–2 and 4–3, Z0 shunt arms 1–4 and 2–3.
 */
export function branchLine(f0: number, er: number, loss: { a: number; b: number }, spread: LineSpread, freqHz: Float64Array, rnd: Random): Network {
  const z = (zn: number) => zn * (1 + rnd.normal(0, spread.impedance));
  const l = () => quarterWave(f0, er) * (1 + rnd.normal(0, spread.length));
  const alpha = lineLoss(loss.a, loss.b);
  const za = 50 / Math.SQRT2;
  return nodalNetwork(
    4,
    [tline(0, 1, z(za), l(), er, alpha), tline(3, 2, z(za), l(), er, alpha), tline(0, 3, z(50), l(), er, alpha), tline(1, 2, z(50), l(), er, alpha)],
    freqHz,
  );
}

/**
 * A backward-wave coupled-line coupler (port 1 in, 2 through, 3 coupled at the
 * input's end, 4 isolated), by even/odd-mode analysis (Pozar §7.6, from
 * memory): each mode is a line of Z0e (or Z0o) and εe (or εo) between
 * Z0 terminations, with reflection Γe, Γo and transmission Te, To;
 * S11 = (Γe + Γo)/2, S31 = (Γe − Γo)/2, S21 = (Te + To)/2, S41 = (Te − To)/2,
 * and the rest by the coupler's two symmetries. Unequal mode permittivities
 * (as in microstrip) give the finite directivity of a real coupler.
 */
export function coupledLine(
  f0: number,
  couplingDb: number,
  modes: { erEven: number; erOdd: number; zScale?: number },
  loss: { a: number; b: number },
  spread: LineSpread,
  freqHz: Float64Array,
  rnd: Random,
): Network {
  const k = Math.pow(10, -couplingDb / 20);
  // zScale: the built coupler's impedance √(Z0e·Z0o) against 50 Ω (a manufacturing offset that sets its match, not its coupling)
  const zs = modes.zScale ?? 1;
  const z0e = 50 * zs * Math.sqrt((1 + k) / (1 - k)) * (1 + rnd.normal(0, spread.impedance));
  const z0o = 50 * zs * Math.sqrt((1 - k) / (1 + k)) * (1 + rnd.normal(0, spread.impedance));
  const len = quarterWave(f0, (modes.erEven + modes.erOdd) / 2) * (1 + rnd.normal(0, spread.length));
  const alpha = lineLoss(loss.a, loss.b);
  const even = chainToNetwork([line(z0e, len, modes.erEven, alpha)], freqHz);
  const odd = chainToNetwork([line(z0o, len, modes.erOdd, alpha)], freqHz);
  const s = new Float64Array(freqHz.length * 32);
  for (let q = 0; q < freqHz.length; q++) {
    const ge = c(even.s[8 * q], even.s[8 * q + 1]),
      go = c(odd.s[8 * q], odd.s[8 * q + 1]);
    const te = c(even.s[8 * q + 4], even.s[8 * q + 5]),
      to = c(odd.s[8 * q + 4], odd.s[8 * q + 5]);
    const half = (x: C) => c(x.re / 2, x.im / 2);
    const a = half(add(ge, go)),
      cp = half(sub(ge, go)),
      t = half(add(te, to)),
      iso = half(sub(te, to));
    const m: C[][] = [
      [a, t, cp, iso],
      [t, a, iso, cp],
      [cp, iso, a, t],
      [iso, cp, t, a],
    ];
    for (let i = 0; i < 4; i++) for (let j = 0; j < 4; j++) s.set([m[i][j].re, m[i][j].im], 32 * q + 2 * (4 * i + j));
  }
  return makeNetwork(freqHz, 50, s, 4);
}

/**
 * A coaxial cable assembly: a line of Z0 and εr with α = a·√f + b·f, and at
 * each end a connector transition modelled as a shunt capacitance between
 * two short series inductances.
 */
export function cable(
  lengthM: number,
  z0: number,
  er: number,
  loss: { a: number; b: number },
  connector: { l: number; c: number },
  freqHz: Float64Array,
  rnd: Random,
): Network {
  const zc = z0 * (1 + rnd.normal(0, 0.004));
  const len = lengthM * (1 + rnd.normal(0, 0.001));
  const cc = () => connector.c * (1 + rnd.normal(0, 0.1));
  const lc = () => connector.l * (1 + rnd.normal(0, 0.1));
  const transition = () => {
    const l1 = lc(),
      cap = cc(),
      l2 = lc();
    return [series((w: number) => c(0, w * l1)), shunt((w: number) => c(0, w * cap)), series((w: number) => c(0, w * l2))];
  };
  return chainToNetwork([...transition(), line(zc, len, er, lineLoss(loss.a, loss.b)), ...transition()], freqHz);
}
