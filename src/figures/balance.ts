/**
 * Figures of a pair of parameters [A, B] at each point:
 *   directivity, on [coupled, isolated]: 20·log10|A| − 20·log10|B| dB (= isolation − coupling)
 *   amplitude-balance: 20·log10|A| − 20·log10|B| dB, nominal 0
 *   phase-balance: d = ∠A − ∠B; value = nominal + wrap(d − nominal), wrap into (−180°, 180°];
 *     nominal 0, or the part's phase-split (90° for a hybrid, 180° for a balun by default)
 */
import { classOf } from '../classes/registry.js';
import { entry } from '../network/network.js';
import { db, phaseDeg } from '../network/traces.js';
import type { FigureContext, FigureDef, Item, PartContext } from './types.js';

function pairDb(ctx: FigureContext, item: Item): Float64Array {
  const [a, b] = item.params;
  const da = db(entry(ctx.network, a.to, a.from));
  const dbb = db(entry(ctx.network, b.to, b.from));
  return da.map((v, k) => v - dbb[k]);
}

/** Wraps an angle in degrees into (−180, 180]. */
export function wrap180(d: number): number {
  let r = d % 360;
  if (r > 180) r -= 360;
  else if (r <= -180) r += 360;
  return r;
}

export function defaultPhaseSplit(part: PartContext): number {
  return part.phaseSplitDeg ?? classOf(part.partClass).phaseSplitDeg;
}

export const BALANCE_FIGURES: readonly FigureDef[] = [
  {
    id: 'directivity',
    title: 'Directivity',
    unit: 'dB',
    operands: 'pair',
    shape: 'trace',
    worse: 'lower',
    definition: 'on [coupled, isolated]: 20·log10|A| − 20·log10|B| dB, i.e. isolation − coupling',
    perPoint: pairDb,
  },
  {
    id: 'amplitude-balance',
    title: 'Amplitude balance',
    unit: 'dB',
    operands: 'pair',
    shape: 'trace',
    worse: 'nominal',
    definition: '20·log10|A| − 20·log10|B| dB (nominal 0)',
    defaultNominal: () => 0,
    perPoint: pairDb,
  },
  {
    id: 'phase-balance',
    title: 'Phase balance',
    unit: 'deg',
    operands: 'pair',
    shape: 'trace',
    worse: 'nominal',
    definition: "∠A − ∠B, wrapped into nominal ± 180° (nominal 0; 90° for a hybrid, 180° for a balun, or the part's phase-split)",
    defaultNominal: ({ part }) => defaultPhaseSplit(part),
    perPoint: (ctx, item) => {
      const [a, b] = item.params;
      const pa = phaseDeg(entry(ctx.network, a.to, a.from));
      const pb = phaseDeg(entry(ctx.network, b.to, b.from));
      const nominal = ctx.nominal ?? defaultPhaseSplit(ctx.part);
      return pa.map((v, k) => nominal + wrap180(v - pb[k] - nominal));
    },
  },
];
