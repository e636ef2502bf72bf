/**
 * Band scalars: one value per unit per band, the peak-to-peak (max − min) over
 * the band's evaluation set of a level trace:
 *   gain-flatness: of 20·log10|X|;  coupling-flatness: of −20·log10|X|;
 *   passband-ripple: of the insertion loss −20·log10|X|
 */
import { entry } from '../network/network.js';
import { db, lossDb } from '../network/traces.js';
import type { FigureDef } from './types.js';

const span = (id: string, title: string, definition: string, f: typeof db): FigureDef => ({
  id,
  title,
  unit: 'dB',
  operands: 'each',
  shape: 'span',
  worse: 'higher',
  definition,
  perPoint: (ctx, item) => f(entry(ctx.network, item.params[0].to, item.params[0].from)),
});

export const FLATNESS_FIGURES: readonly FigureDef[] = [
  span('gain-flatness', 'Gain flatness', 'peak-to-peak of the gain 20·log10|X| over the band', db),
  span('coupling-flatness', 'Coupling flatness', 'peak-to-peak of the coupling −20·log10|X| over the band', lossDb),
  span('passband-ripple', 'Passband ripple', 'peak-to-peak of the insertion loss −20·log10|X| over the band', lossDb),
];
