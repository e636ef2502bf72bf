/**
 * N-port circuits by nodal analysis: elements (lines, resistors, admittances)
 * stamped into one admittance matrix over the port nodes at each frequency,
 * then converted to S. Used for the divider and the hybrid, whose topology is
 * not a chain.
 */
import { c, div, mul, type C } from '../network/complex.js';
import { yToS } from '../network/convert.js';
import type { Network } from '../network/network.js';

/** A two-terminal or line element between nodes a and b (0-based port nodes). */
export type Stamp = (omega: number, y: Float64Array, n: number) => void;

function addAt(y: Float64Array, n: number, i: number, j: number, v: C): void {
  y[2 * (i * n + j)] += v.re;
  y[2 * (i * n + j) + 1] += v.im;
}

/** An admittance between nodes a and b (b = −1 for ground). */
export const admittance =
  (a: number, b: number, yOf: (omega: number) => C): Stamp =>
  (w, y, n) => {
    const v = yOf(w);
    addAt(y, n, a, a, v);
    if (b >= 0) {
      addAt(y, n, b, b, v);
      addAt(y, n, a, b, c(-v.re, -v.im));
      addAt(y, n, b, a, c(-v.re, -v.im));
    }
  };

export const resistor = (a: number, b: number, ohms: number): Stamp => admittance(a, b, () => c(1 / ohms));

/**
 * A transmission line from node a to node b (both referred to ground) of
 * impedance z0, length, εeff and attenuation α(ω) Np/m:
 * Y11 = Y22 = coth(γl)/Z0, Y12 = Y21 = −csch(γl)/Z0.
 */
export const tline =
  (a: number, b: number, z0: number, lengthM: number, er: number, alpha: (omega: number) => number): Stamp =>
  (w, y, n) => {
    const gl = c(alpha(w) * lengthM, ((w * Math.sqrt(er)) / 299_792_458) * lengthM);
    // cosh and sinh of a complex argument
    const ch = c(Math.cosh(gl.re) * Math.cos(gl.im), Math.sinh(gl.re) * Math.sin(gl.im));
    const sh = c(Math.sinh(gl.re) * Math.cos(gl.im), Math.cosh(gl.re) * Math.sin(gl.im));
    const self = div(ch, mul(sh, c(z0)));
    const mutual = div(c(-1), mul(sh, c(z0)));
    addAt(y, n, a, a, self);
    addAt(y, n, b, b, self);
    addAt(y, n, a, b, mutual);
    addAt(y, n, b, a, mutual);
  };

export function nodalNetwork(ports: number, stamps: readonly Stamp[], freqHz: Float64Array, z0 = 50): Network {
  const size = 2 * ports * ports;
  const y = new Float64Array(freqHz.length * size);
  const one = new Float64Array(size);
  freqHz.forEach((f, k) => {
    one.fill(0);
    for (const s of stamps) s(2 * Math.PI * f, one, ports);
    y.set(one, k * size);
  });
  return yToS(freqHz, y, new Float64Array(ports).fill(z0));
}
