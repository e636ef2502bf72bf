/**
 * Noise figures of a two-port from the noise parameters of its Touchstone
 * file (NFmin, Γopt, Rn at the noise frequencies):
 *
 *   minimum-noise-figure: NFmin as the file gives it, dB;
 *   noise-figure: NF with the source at the reference impedance Z0 (Γs = 0),
 *     from the two-port noise equation
 *       F = Fmin + (4·Rn/Z0) · |Γs − Γopt|² / ((1 − |Γs|²) · |1 + Γopt|²)
 *     (Pozar, Microwave Engineering, ch. 12, from memory), which at Γs = 0 is
 *       F = Fmin + 4·(Rn/Z0) · |Γopt|² / |1 + Γopt|²,   NF = 10·log10 F.
 *
 * Both are evaluated on the noise frequencies, not the network's (FigureDef
 * `grid: 'noise'`). Γopt = −1 (|1 + Γopt| = 0) has no noise figure: NaN there.
 */
import type { NoiseParameters } from '../touchstone/normalize.js';
import type { FigureDef } from './types.js';

/** NF in dB with the source at Z0, at each noise frequency. */
export function noiseFigureAtZ0(noise: NoiseParameters, z0: number): Float64Array {
  const out = new Float64Array(noise.freqHz.length);
  for (let k = 0; k < out.length; k++) {
    const fmin = Math.pow(10, noise.nfMinDb[k] / 10);
    const gr = noise.gammaOpt[2 * k],
      gi = noise.gammaOpt[2 * k + 1];
    const denom = (1 + gr) * (1 + gr) + gi * gi;
    out[k] = denom === 0 ? NaN : 10 * Math.log10(fmin + (4 * (noise.rnOhms[k] / z0) * (gr * gr + gi * gi)) / denom);
  }
  return out;
}

export const NOISE_FIGURES: readonly FigureDef[] = [
  {
    id: 'noise-figure',
    title: 'Noise figure',
    unit: 'dB',
    operands: 'each',
    shape: 'trace',
    worse: 'higher',
    grid: 'noise',
    defaultOn: ['S21'],
    definition: 'NF with the source at the reference impedance: 10·log10(Fmin + 4·(Rn/Z0)·|Γopt|²/|1 + Γopt|²), at the noise frequencies',
    undefinedWhere: 'Γopt = −1 (|1 + Γopt| = 0)',
    perPoint: (ctx) => noiseFigureAtZ0(ctx.noise as NoiseParameters, ctx.network.z0[0]),
  },
  {
    id: 'minimum-noise-figure',
    title: 'Minimum noise figure',
    unit: 'dB',
    operands: 'each',
    shape: 'trace',
    worse: 'higher',
    grid: 'noise',
    defaultOn: ['S21'],
    definition: 'NFmin of the noise parameters, dB, at the noise frequencies',
    perPoint: (ctx) => Float64Array.from((ctx.noise as NoiseParameters).nfMinDb),
  },
];
