/** The part file's bands → NormalizedBand by name; a broken band is reported once, not again at every use. */
import type { NormalizedBand } from './normalize.js';
import { isObj, type Context, type Obj } from './context.js';
import { parseQuantity } from './quantity.js';

export function normalizeBands(spec: Obj, { err, at }: Context): { bands: Map<string, NormalizedBand>; brokenBands: Set<string> } {
  const bands = new Map<string, NormalizedBand>();
  /** Bands that are named but broken: their errors are reported once, not again at every use. */
  const brokenBands = new Set<string>();
  if (isObj(spec.bands)) {
    for (const name of Object.keys(spec.bands)) brokenBands.add(name);
    for (const [name, b] of Object.entries(spec.bands)) {
      if (!isObj(b) || b.from === undefined || b.to === undefined) continue;
      const from = parseQuantity(b.from as string),
        to = parseQuantity(b.to as string);
      if (!from.ok || !to.ok) continue;
      if (from.value < 0) {
        err('bad-value', `bands.${name}.from`, `band ${name} starts at a negative frequency (${b.from}); frequencies are 0 Hz or above`);
        continue;
      }
      if (to.value < from.value) {
        err('bad-value', `bands.${name}.to`, `band ${name} ends below where it starts (${b.from} to ${b.to}); from ≤ to (equal for a single frequency)`);
        continue;
      }
      bands.set(name, { name, fromHz: from.value, toHz: to.value, at: at(`bands.${name}`) });
      brokenBands.delete(name);
    }
  }

  return { bands, brokenBands };
}
