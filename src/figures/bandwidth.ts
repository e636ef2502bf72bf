/**
 * Where a passband's response edges sit. With IL(f) = −20·log10|X| and
 * best = the least IL over the band's evaluation set, the edges fL and fH are
 * where IL first reaches best + level (default 3 dB) walking outwards from the
 * best measured point, each found by linear interpolation of IL between the
 * two measured points around the crossing. Over the whole measured range, so
 * edges may lie outside the band given.
 *   bandwidth = fH − fL;  center-frequency = (fL + fH)/2 (arithmetic mean)
 */
import { entry } from '../network/network.js';
import { lossDb } from '../network/traces.js';
import { FigureUndefined, type FigureContext, type FigureDef, type Item } from './types.js';

export function responseEdges(ctx: FigureContext, item: Item): { lowHz: number; highHz: number } {
  const f = ctx.network.freqHz;
  const il = lossDb(entry(ctx.network, item.params[0].to, item.params[0].from));
  let best = -1;
  for (let k = 0; k < f.length; k++) {
    if (f[k] < ctx.band.fromHz || f[k] > ctx.band.toHz) continue;
    if (best < 0 || il[k] < il[best]) best = k;
  }
  if (best < 0) throw new FigureUndefined('no measured point lies inside the band to find the best insertion loss');
  const threshold = il[best] + ctx.levelDb;
  const cross = (k0: number, k1: number) => f[k0] + ((threshold - il[k0]) / (il[k1] - il[k0])) * (f[k1] - f[k0]);
  let lo = best;
  while (lo > 0 && il[lo - 1] < threshold) lo--;
  if (lo === 0) throw new FigureUndefined(`the response does not fall ${ctx.levelDb} dB below its best before the lowest measured frequency`);
  let hi = best;
  while (hi < f.length - 1 && il[hi + 1] < threshold) hi++;
  if (hi === f.length - 1) throw new FigureUndefined(`the response does not fall ${ctx.levelDb} dB below its best before the highest measured frequency`);
  return { lowHz: cross(lo, lo - 1), highHz: cross(hi, hi + 1) };
}

export const BANDWIDTH_FIGURES: readonly FigureDef[] = [
  {
    id: 'bandwidth',
    title: 'Bandwidth',
    unit: 'Hz',
    operands: 'each',
    shape: 'scalar',
    worse: 'lower',
    definition: 'fH − fL, the edges at best insertion loss + level (default 3 dB)',
    accepts: ['level'],
    scalar: (ctx, item) => {
      const e = responseEdges(ctx, item);
      return e.highHz - e.lowHz;
    },
  },
  {
    id: 'center-frequency',
    title: 'Centre frequency',
    unit: 'Hz',
    operands: 'each',
    shape: 'scalar',
    worse: 'nominal',
    definition: '(fL + fH)/2, the edges at best insertion loss + level (default 3 dB); nominal defaults to the band centre',
    accepts: ['level'],
    defaultNominal: ({ band }) => (band.fromHz + band.toHz) / 2,
    scalar: (ctx, item) => {
      const e = responseEdges(ctx, item);
      return (e.lowHz + e.highHz) / 2;
    },
  },
];
