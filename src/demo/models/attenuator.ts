/**
 * A pi-pad attenuator of chip resistors with their parasitics: for A dB at
 * Z0, K = 10^(A/20), Rshunt = Z0·(K + 1)/(K − 1), Rseries = Z0·(K² − 1)/(2K)
 * (common practice); each shunt resistor carries a series inductance to
 * ground, the series resistor a parallel capacitance, each node a pad
 * capacitance. `seriesError` models a damaged series resistor.
 */
import { add, c, div, ONE, type C } from '../../network/complex.js';
import type { Network } from '../../network/network.js';
import type { Random } from '../random.js';
import { chainToNetwork, series, shunt } from '../circuit.js';

export interface PadDesign {
  readonly attenuationDb: number;
  readonly tolerance: number;
  readonly shuntL: number;
  readonly seriesC: number;
  readonly padC: number;
  readonly seriesError?: number;
}

export function piPad(d: PadDesign, freqHz: Float64Array, rnd: Random, z0 = 50): Network {
  const k = Math.pow(10, d.attenuationDb / 20);
  const rsh = (z0 * (k + 1)) / (k - 1);
  const rse = (z0 * (k * k - 1)) / (2 * k);
  const vary = () => 1 + rnd.normal(0, d.tolerance);
  const r1 = rsh * vary(),
    r2 = rsh * vary(),
    r3 = rse * vary() * (1 + (d.seriesError ?? 0));
  const shuntBranch = (r: number) => shunt((w): C => add(div(ONE, c(r, w * d.shuntL)), c(0, w * d.padC)));
  return chainToNetwork([shuntBranch(r1), series((w) => div(ONE, add(c(1 / r3), c(0, w * d.seriesC)))), shuntBranch(r2)], freqHz, z0);
}
