/** Every built-in figure, by id. Custom figures of a part join them per part (expression.ts). */
import { BALANCE_FIGURES } from './balance.js';
import { BANDWIDTH_FIGURES } from './bandwidth.js';
import { DELAY_FIGURES } from './delay.js';
import { FLATNESS_FIGURES } from './flatness.js';
import { LOSS_FIGURES } from './loss.js';
import { NOISE_FIGURES } from './noise.js';
import { STABILITY_FIGURES } from './stability.js';
import type { FigureDef } from './types.js';

export const FIGURES: ReadonlyMap<string, FigureDef> = new Map(
  [...LOSS_FIGURES, ...BALANCE_FIGURES, ...DELAY_FIGURES, ...STABILITY_FIGURES, ...FLATNESS_FIGURES, ...BANDWIDTH_FIGURES, ...NOISE_FIGURES].map((f) => [
    f.id,
    f,
  ]),
);
