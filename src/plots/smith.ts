/**
 * The Smith chart of reflection parameters (S11, S22 …): each unit's Γ over
 * frequency drawn on the Γ plane, inside the unit circle, over the usual grid
 * of constant-resistance circles (r = 0.2, 0.5, 1, 2, 5) and constant-reactance
 * arcs (x = ±0.2, ±0.5, ±1, ±2, ±5), normalized to the reference impedance.
 * A point Γ = (z − 1)/(z + 1) of normalized impedance z = r + jx; the circle
 * of constant r has centre (r/(1 + r), 0) and radius 1/(1 + r), the arc of
 * constant x centre (1, 1/x) and radius 1/|x| (common practice, the
 * construction of P. H. Smith's chart).
 *
 * Traces are not thinned by frequency columns as the other plots are, but by
 * a uniform stride to at most SMITH_POINTS points per trace, in frequency
 * order (`k`), since a Smith trace is a curve in the plane, not a function.
 */
import type { UnitData } from '../evaluate/evaluate.js';
import { itemOnNetwork } from '../evaluate/mixed.js';
import { entry } from '../network/network.js';
import type { NormalizedPart } from '../part-file/normalize.js';
import { parameterName, parseParameter } from '../part-file/parameter.js';
import type { PlotDef } from '../classes/registry.js';
import { DASHES, PALETTE } from './spec.js';
import type { PlotModel, TracePoint } from './model.js';

export const SMITH_POINTS = 400;
export function buildSmith(part: NormalizedPart, units: readonly UnitData[], def: PlotDef, index: number): PlotModel | null {
  const ports = units[0]?.network.ports ?? 0;
  const params = (def.on ?? ['S11'])
    .map(parseParameter)
    .flatMap((p) => (p.ok && p.value.to === p.value.from && p.value.to <= ports && !p.value.mode ? [p.value] : []));
  if (!params.length) return null;
  const items = params.map(parameterName);
  const traces: TracePoint[] = [];
  params.forEach((p, i) => {
    for (const u of units) {
      const on = itemOnNetwork(u.network, part.mixedModePairs, { params: [p], label: items[i] }, u.mixedModeOrder);
      const t = entry(on.network, on.item.params[0].to, on.item.params[0].from);
      const n = t.re.length;
      const stride = Math.max(1, Math.ceil(n / SMITH_POINTS));
      for (let k = 0; k < n; k += stride) traces.push({ x: t.re[k], y: t.im[k], item: items[i], trace: `${u.unit} ${items[i]}`, k });
      if ((n - 1) % stride) traces.push({ x: t.re[n - 1], y: t.im[n - 1], item: items[i], trace: `${u.unit} ${items[i]}`, k: n - 1 });
    }
  });
  const serials = new Set(units.map((u) => u.serial ?? u.unit));
  const title = def.title ?? 'Smith chart';
  return {
    id: `plot-${index + 1}`,
    kind: 'smith',
    title,
    description: `${title}: the reflection coefficient of ${items.join(', ')} for ${serials.size} measured unit${serials.size === 1 ? '' : 's'} over the measured range, on a Smith chart normalized to the reference impedance.`,
    xTitle: 'Re Γ',
    yTitle: 'Im Γ',
    xDomain: [-1.05, 1.05],
    yDomain: [-1.05, 1.05],
    downward: false,
    items,
    traces,
    median: [],
    envelope: [],
    regions: [],
    edges: [],
    seriesEdges: [],
    seriesLimits: [],
    colors: items.map((_, i) => PALETTE[i % PALETTE.length]),
    dashes: items.map((_, i) => DASHES[i % DASHES.length]),
    unitCount: serials.size,
    measurementCount: units.length,
  };
}
