/**
 * A trace figure of one unit at every point of its grid (the network's
 * frequencies, or the noise frequencies for noise figures): what plots draw
 * and what comparisons subtract. The figures themselves are evaluated by
 * evaluate.ts over their bands.
 */
import type { FigureContext, FigureDef, Item } from '../figures/types.js';
import type { NormalizedPart } from '../part-file/normalize.js';
import type { UnitData } from './evaluate.js';
import { itemOnNetwork } from './mixed.js';

export interface Trace {
  readonly freqHz: Float64Array;
  readonly values: Float64Array;
}

export interface TraceOptions {
  readonly aperture: number;
  readonly nominal: number | null;
  readonly band: { readonly fromHz: number; readonly toHz: number };
}

/** The figure's value at every point of the unit's grid, or null when the figure has no per-point values or the unit lacks its grid (noise). */
export function figureTrace(part: NormalizedPart, fig: FigureDef, item: Item, u: UnitData, o: TraceOptions): Trace | null {
  if (!fig.perPoint) return null;
  if (fig.grid === 'noise' && !u.noise) return null;
  const ctx: FigureContext = {
    network: u.network,
    part: { partClass: part.partClass, ways: part.ways, phaseSplitDeg: part.phaseSplitDeg },
    aperture: o.aperture,
    levelDb: 3,
    nominal: o.nominal,
    band: o.band,
  };
  const on = itemOnNetwork(u.network, part.mixedModePairs, item, u.mixedModeOrder);
  const freqHz = fig.grid === 'noise' && u.noise ? u.noise.freqHz : u.network.freqHz;
  return { freqHz, values: fig.perPoint({ ...ctx, network: on.network, noise: u.noise ?? null }, on.item) };
}
