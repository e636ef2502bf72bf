/**
 * Group delay of X: τ = −(1/360)·dφ/df seconds, φ the unwrapped phase of X in
 * degrees, from central differences on the measured grid (one-sided at the
 * ends), optionally over ±aperture points. group-delay-variation is its
 * peak-to-peak over the band.
 */
import { entry } from '../network/network.js';
import { groupDelay } from '../network/traces.js';
import { FigureUndefined, type FigureContext, type FigureDef, type Item } from './types.js';

const delay = (ctx: FigureContext, item: Item) => {
  const n = ctx.network.freqHz.length;
  if (n < 2)
    throw new FigureUndefined(
      `group delay is the derivative of the phase over frequency, and a file of ${n} measured point has none; it needs at least two frequencies`,
    );
  return groupDelay(ctx.network.freqHz, entry(ctx.network, item.params[0].to, item.params[0].from), ctx.aperture);
};

export const DELAY_FIGURES: readonly FigureDef[] = [
  {
    id: 'group-delay',
    title: 'Group delay',
    unit: 's',
    operands: 'each',
    shape: 'trace',
    worse: 'higher',
    definition: '−(1/360)·dφ/df of the unwrapped phase φ (deg), central differences over ±aperture points',
    accepts: ['aperture'],
    perPoint: delay,
  },
  {
    id: 'group-delay-variation',
    title: 'Group delay variation',
    unit: 's',
    operands: 'each',
    shape: 'span',
    worse: 'higher',
    definition: 'peak-to-peak of the group delay over the band',
    accepts: ['aperture'],
    perPoint: delay,
  },
];
