/**
 * A Chebyshev bandpass filter of coupled lumped resonators with finite
 * unloaded Q: the lowpass prototype g-values (Matthaei, Young & Jones; Pozar
 * §8.3, from memory) transformed to alternating series and shunt LC
 * resonators (Pozar §8.4), each inductor and capacitor carrying the loss of
 * its Q and a seeded tolerance.
 */
import { div, ONE, add, type C } from '../../network/complex.js';
import type { Network } from '../../network/network.js';
import type { Random } from '../random.js';
import { capacitorY, chainToNetwork, inductorZ, series, shunt, type Element } from '../circuit.js';

/** Chebyshev lowpass prototype values g1…gN (and g(N+1), the load) for ripple in dB. */
export function chebyshevG(order: number, rippleDb: number): number[] {
  const beta = Math.log(1 / Math.tanh(rippleDb / 17.37));
  const gamma = Math.sinh(beta / (2 * order));
  const a = (k: number) => Math.sin(((2 * k - 1) * Math.PI) / (2 * order));
  const b = (k: number) => gamma * gamma + Math.sin((k * Math.PI) / order) ** 2;
  const g = [(2 * a(1)) / gamma];
  for (let k = 2; k <= order; k++) g.push((4 * a(k - 1) * a(k)) / (b(k - 1) * g[k - 2]));
  g.push(order % 2 === 1 ? 1 : 1 / Math.tanh(beta / 4) ** 2);
  return g;
}

export interface BandpassDesign {
  readonly order: number;
  readonly rippleDb: number;
  readonly lowHz: number;
  readonly highHz: number;
  readonly q: number;
  /** Relative standard deviation of every L and C (e.g. 0.003). */
  readonly tolerance: number;
}

export function bandpass(design: BandpassDesign, freqHz: Float64Array, rnd: Random, z0 = 50): Network {
  const w1 = 2 * Math.PI * design.lowHz,
    w2 = 2 * Math.PI * design.highHz;
  const w0 = Math.sqrt(w1 * w2);
  const delta = (w2 - w1) / w0;
  const g = chebyshevG(design.order, design.rippleDb);
  const elements: Element[] = [];
  const vary = () => 1 + rnd.normal(0, design.tolerance);
  for (let k = 0; k < design.order; k++) {
    if (k % 2 === 0) {
      // shunt parallel LC resonator
      const l = ((delta * z0) / (w0 * g[k])) * vary();
      const cap = (g[k] / (w0 * delta * z0)) * vary();
      const yl = inductorZ(l, design.q, w0);
      const yc = capacitorY(cap, design.q, w0);
      elements.push(shunt((w) => add(div(ONE, yl(w)), yc(w))));
    } else {
      // series LC resonator
      const l = ((g[k] * z0) / (w0 * delta)) * vary();
      const cap = (delta / (w0 * g[k] * z0)) * vary();
      const zl = inductorZ(l, design.q, w0);
      const yc = capacitorY(cap, design.q, w0);
      elements.push(series((w): C => add(zl(w), div(ONE, yc(w)))));
    }
  }
  return chainToNetwork(elements, freqHz, z0);
}
