/**
 * Two-port circuits for the demo generator: chains of series impedances,
 * shunt admittances and transmission lines, multiplied as ABCD matrices at
 * each frequency and turned into S (network/twoport.ts).
 */
import { add, c, div, mul, ONE, ZERO, type C } from '../network/complex.js';
import type { Network } from '../network/network.js';
import { abcdToS } from '../network/twoport.js';

export type Abcd = readonly [C, C, C, C];

/** An element's ABCD matrix at angular frequency ω (rad/s). */
export type Element = (omega: number) => Abcd;

export const series =
  (z: (omega: number) => C): Element =>
  (w) => [ONE, z(w), ZERO, ONE];
export const shunt =
  (y: (omega: number) => C): Element =>
  (w) => [ONE, ZERO, y(w), ONE];

/**
 * A transmission line of length `lengthM`, characteristic impedance z0,
 * relative permittivity er and attenuation alpha(ω) in Np/m:
 * [[cosh γl, Z0 sinh γl], [sinh γl / Z0, cosh γl]], γ = α + jω√εr/c.
 */
export const line =
  (z0: number, lengthM: number, er: number, alpha: (omega: number) => number): Element =>
  (w) => {
    const beta = (w * Math.sqrt(er)) / 299_792_458;
    const a = alpha(w) * lengthM,
      b = beta * lengthM;
    // cosh(a + jb) = cosh a cos b + j sinh a sin b; sinh(a + jb) = sinh a cos b + j cosh a sin b
    const ch = c(Math.cosh(a) * Math.cos(b), Math.sinh(a) * Math.sin(b));
    const sh = c(Math.sinh(a) * Math.cos(b), Math.cosh(a) * Math.sin(b));
    return [ch, mul(sh, c(z0)), div(sh, c(z0)), ch];
  };

export function chainAt(elements: readonly Element[], omega: number): Abcd {
  let m: Abcd = [ONE, ZERO, ZERO, ONE];
  for (const el of elements) {
    const e = el(omega);
    m = [
      add(mul(m[0], e[0]), mul(m[1], e[2])),
      add(mul(m[0], e[1]), mul(m[1], e[3])),
      add(mul(m[2], e[0]), mul(m[3], e[2])),
      add(mul(m[2], e[1]), mul(m[3], e[3])),
    ];
  }
  return m;
}

/** S-parameters of the chain at every frequency, referenced to z0 on both ports. */
export function chainToNetwork(elements: readonly Element[], freqHz: Float64Array, z0 = 50): Network {
  const data = new Float64Array(freqHz.length * 8);
  freqHz.forEach((f, k) => {
    const m = chainAt(elements, 2 * Math.PI * f);
    m.forEach((v, e) => {
      data[8 * k + 2 * e] = v.re;
      data[8 * k + 2 * e + 1] = v.im;
    });
  });
  return abcdToS({ kind: 'ABCD', freqHz, data }, [z0, z0]);
}

/** Impedance of an inductor L with series loss for unloaded Q at ω0: R = ω0 L / Q. */
export const inductorZ =
  (l: number, q: number, omega0: number) =>
  (w: number): C =>
    c((omega0 * l) / q, w * l);
/** Admittance of a capacitor C with loss for unloaded Q at ω0: G = ω0 C / Q. */
export const capacitorY =
  (cap: number, q: number, omega0: number) =>
  (w: number): C =>
    c((omega0 * cap) / q, w * cap);
