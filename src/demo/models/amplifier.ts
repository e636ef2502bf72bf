/**
 * A resistive-feedback FET gain block. The core is the intrinsic device, a
 * transconductance gm·e^(−jωτ) with Cgs, Cgd, Cds and output resistance Rds,
 * with a feedback resistor Rf from drain to gate, in admittance parameters
 * (Gonzalez, Microwave Transistor Amplifiers, ch. 2, from memory):
 *   y11 = jω(Cgs + Cgd) + 1/Rf   y12 = −jωCgd − 1/Rf
 *   y21 = gm·e^(−jωτ) − jωCgd − 1/Rf   y22 = 1/Rds + jω(Cds + Cgd) + 1/Rf
 * A series gate resistance and a drain bond-wire inductance are cascaded
 * as ABCD matrices around it. Temperature lowers gm by a coefficient per
 * kelvin, as carrier mobility falls. Active: it is not passive, and its
 * reverse transmission is small but not zero.
 */
import { add, c, div, mul, neg, ONE, sub, ZERO, type C } from '../../network/complex.js';
import type { Network } from '../../network/network.js';
import { abcdToS } from '../../network/twoport.js';
import type { Random } from '../random.js';

export interface GainBlockDesign {
  readonly gm: number;
  readonly cgs: number;
  readonly cgd: number;
  readonly cds: number;
  readonly rds: number;
  readonly tau: number;
  readonly rf: number;
  readonly rg: number;
  readonly ld: number;
  readonly tolerance: number;
  /** Relative change of gm per kelvin (negative). */
  readonly gmTempco: number;
}

type M2 = [C, C, C, C];

const mul2 = (a: M2, b: M2): M2 => [
  add(mul(a[0], b[0]), mul(a[1], b[2])),
  add(mul(a[0], b[1]), mul(a[1], b[3])),
  add(mul(a[2], b[0]), mul(a[3], b[2])),
  add(mul(a[2], b[1]), mul(a[3], b[3])),
];

/** ABCD from Y: A = −y22/y21, B = −1/y21, C = −Δy/y21, D = −y11/y21. */
function yToAbcd([y11, y12, y21, y22]: M2): M2 {
  const det = sub(mul(y11, y22), mul(y12, y21));
  return [neg(div(y22, y21)), neg(div(ONE, y21)), neg(div(det, y21)), neg(div(y11, y21))];
}

export function gainBlock(d: GainBlockDesign, freqHz: Float64Array, rnd: Random, temperatureC: number): Network {
  const v = () => 1 + rnd.normal(0, d.tolerance);
  const gm = d.gm * v() * (1 + d.gmTempco * (temperatureC - 25));
  const cgs = d.cgs * v(),
    cgd = d.cgd * v(),
    cds = d.cds * v(),
    rf = d.rf * v(),
    rds = d.rds * v();
  const data = new Float64Array(freqHz.length * 8);
  freqHz.forEach((f, k) => {
    const w = 2 * Math.PI * f;
    const yf = c(1 / rf);
    const core: M2 = [
      add(c(0, w * (cgs + cgd)), yf),
      sub(c(0, -w * cgd), yf),
      sub(sub(c(gm * Math.cos(-w * d.tau), gm * Math.sin(-w * d.tau)), c(0, w * cgd)), yf),
      add(c(1 / rds, w * (cds + cgd)), yf),
    ];
    const gate: M2 = [ONE, c(d.rg), ZERO, ONE];
    const drain: M2 = [ONE, c(0, w * d.ld), ZERO, ONE];
    const m = mul2(mul2(gate, yToAbcd(core)), drain);
    m.forEach((x, e) => data.set([x.re, x.im], 8 * k + 2 * e));
  });
  return abcdToS({ kind: 'ABCD', freqHz, data }, [50, 50]);
}
