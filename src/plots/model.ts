/**
 * The data of one plot, ready for a spec: traces of every unit and
 * parameter, the median and min–max envelope per parameter, and the limits as
 * forbidden regions over exactly their bands. All in display units (MHz or
 * GHz chosen from the range; ns or ps for delay).
 */
import type { UnitData } from '../evaluate/evaluate.js';
import { DASHES, LIMIT_FILL, PALETTE } from './spec.js';
import { buildSmith } from './smith.js';

/** The plot name of a Smith chart in `plots` and `extra-plots` (it is a plot, not a figure). */
export const SMITH = 'smith';
import { FIGURES } from '../figures/registry.js';
import type { FigureDef, Item } from '../figures/types.js';
import { frequencyUnitFor } from '../format/units.js';
import { interpolateAt as valueAt } from '../network/interpolate.js';
import { largest, median as medianOf, smallest } from '../evaluate/stats.js';
import { figureTrace } from '../evaluate/trace.js';
import type { NormalizedCheck, NormalizedPart } from '../part-file/normalize.js';
import { parameterName, parseParameter, type SParameter } from '../part-file/parameter.js';
import { classOf, DOWNWARD, type PlotDef } from '../classes/registry.js';

export interface Region {
  readonly x0: number;
  readonly x1: number;
  readonly y0: number;
  readonly y1: number;
}

export interface Edge {
  readonly x0: number;
  readonly x1: number;
  readonly y: number;
}

/**
 * The edge of a limit that applies to some series of the plot only, never shaded: in the dash of its
 * parameter when it covers one parameter, in the colour of its condition when it covers one condition,
 * otherwise in the limit colour.
 */
export interface SeriesEdge extends Edge {
  readonly color: string;
  readonly dash: readonly number[];
}

export interface TracePoint {
  readonly x: number;
  readonly y: number;
  /** Parameter label, e.g. "S21". */
  readonly item: string;
  /** Unit label + parameter: one line each. */
  readonly trace: string;
  /** The point's index in frequency order, where the line is not drawn in x order (the Smith chart). */
  readonly k?: number;
}

export interface BandPoint {
  readonly x: number;
  readonly lo: number;
  readonly hi: number;
  readonly item: string;
}

export interface PlotModel {
  readonly id: string;
  /** A Smith chart of reflection parameters, drawn on the Γ plane (smith.ts), rather than a figure over frequency. */
  readonly kind?: 'smith';
  readonly title: string;
  /** A sentence for screen readers: what is drawn, over what, against which limits. */
  readonly description: string;
  readonly xTitle: string;
  readonly yTitle: string;
  readonly xDomain: readonly [number, number];
  readonly yDomain: readonly [number, number];
  readonly downward: boolean;
  readonly items: readonly string[];
  readonly traces: readonly TracePoint[];
  readonly median: readonly TracePoint[];
  readonly envelope: readonly BandPoint[];
  readonly regions: readonly Region[];
  readonly edges: readonly Edge[];
  /** Limits of one series (a parameter, or the units of one condition): their edges in the series' style. */
  readonly seriesEdges: readonly SeriesEdge[];
  /** The limits of some series only, for the legend: what they cover, in their style. */
  readonly seriesLimits: ReadonlyArray<{ readonly label: string; readonly color: string; readonly dash: readonly number[] }>;
  /** Colour and dash of each series (index as items), e.g. by condition when the units were measured under several. */
  readonly colors: readonly string[];
  readonly dashes: ReadonlyArray<readonly number[]>;
  /** Distinct units (serials) drawn. */
  readonly unitCount: number;
  /** Measurements drawn (a unit measured at three temperatures counts three times). */
  readonly measurementCount: number;
}

interface Display {
  readonly scale: number;
  readonly label: string;
}

export function valueDisplay(unit: string, values: number[]): Display {
  if (unit === 's') {
    const m = largest(values.map(Math.abs).filter(Number.isFinite).concat(0));
    return m < 1e-9 ? { scale: 1e12, label: 'ps' } : { scale: 1e9, label: 'ns' };
  }
  return { scale: 1, label: unit === 'deg' ? 'deg' : unit };
}

/** The plot definitions of a part: its own `plots` (replacing), or the class defaults plus `extra-plots`. */
export function plotDefs(part: NormalizedPart): PlotDef[] {
  const own = (key: 'plots' | 'extra-plots'): PlotDef[] | null => {
    const list = part.spec[key];
    if (!Array.isArray(list)) return null;
    return list.flatMap((p) => {
      if (typeof p !== 'object' || p === null || Array.isArray(p) || typeof p.figure !== 'string') return [];
      const on = Array.isArray(p.on) ? (p.on.filter((x) => typeof x === 'string') as string[]) : undefined;
      const range = typeof p.band === 'string' ? { band: p.band } : p.range === 'limits' ? 'limits' : 'all';
      return [{ figure: p.figure, on, range, title: typeof p.title === 'string' ? p.title : undefined } as PlotDef];
    });
  };
  const replaced = own('plots');
  if (replaced) return replaced;
  const defaults = classOf(part.partClass).plots;
  const base = defaults.length ? [...defaults] : genericPlots(part);
  return [...base, ...(own('extra-plots') ?? [])];
}

/** For parts without class defaults: one plot per trace figure the limits use. */
function genericPlots(part: NormalizedPart): PlotDef[] {
  const seen = new Set<string>();
  const out: PlotDef[] = [];
  for (const c of part.checks) {
    if (c.change) continue;
    if (c.figure.shape !== 'trace' || seen.has(c.figure.id)) continue;
    seen.add(c.figure.id);
    out.push({ figure: c.figure.id, range: 'limits' });
  }
  return out;
}

export function figureFor(part: NormalizedPart, id: string): FigureDef | undefined {
  return FIGURES.get(id) ?? part.checks.find((c) => c.figure.id === id)?.figure;
}

export function itemsFor(def: PlotDef, fig: FigureDef, matching: readonly NormalizedCheck[], ports: number): Item[] {
  if (fig.operands === 'port-pair') {
    const [a, b] = def.ports ?? [1, 2];
    if (Math.max(a, b) > ports) return [];
    const four: SParameter[] = [
      { to: a, from: a },
      { to: b, from: a },
      { to: a, from: b },
      { to: b, from: b },
    ];
    return [{ params: four, label: `ports ${a}, ${b}` }];
  }
  const own = matching.filter((c) => c.figure.id === fig.id).flatMap((c) => c.items);
  let items: Item[];
  if (own.length) items = own;
  else if (fig.operands === 'expression') return matching[0]?.items.slice() ?? [];
  else {
    const names = def.on ?? [];
    const params = names.map(parseParameter).flatMap((p) => (p.ok ? [p.value] : []));
    items =
      fig.operands === 'pair'
        ? params.length === 2
          ? [{ params, label: params.map(parameterName).join('/') }]
          : []
        : params.map((p) => ({ params: [p], label: parameterName(p) }));
  }
  const unique = new Map(items.map((i) => [i.label, i]));
  return [...unique.values()].filter((i) => i.params.every((p) => p.mode !== undefined || (p.to <= ports && p.from <= ports)));
}

export function rangeFor(def: PlotDef, part: NormalizedPart, matching: readonly NormalizedCheck[], lo: number, hi: number): [number, number] | null {
  if (def.range === 'all') return [lo, hi];
  if (typeof def.range === 'object') {
    const b = part.bands.get(def.range.band);
    return b ? [Math.max(lo, b.fromHz), Math.min(hi, b.toHz)] : null;
  }
  if (!matching.length) return null;
  const from = smallest(matching.map((c) => c.band.fromHz));
  const to = largest(matching.map((c) => c.band.toHz));
  const pad = Math.max((to - from) * 0.25, ((from + to) / 2) * 0.02);
  return [Math.max(lo, from - pad), Math.min(hi, to + pad)];
}

export function buildPlots(part: NormalizedPart, units: readonly UnitData[]): PlotModel[] {
  if (!units.length) return [];
  const ports = units[0].network.ports;
  const lo = largest(units.map((u) => u.network.freqHz[0]));
  const hi = smallest(units.map((u) => u.network.freqHz[u.network.freqHz.length - 1]));
  const out: PlotModel[] = [];
  plotDefs(part).forEach((def, index) => {
    if (def.figure === SMITH) {
      const smith = buildSmith(part, units, def, index);
      if (smith) out.push(smith);
      return;
    }
    const fig = figureFor(part, def.figure);
    if (!fig || fig.shape !== 'trace' || !fig.perPoint) return;
    const limitsFrom = def.limitsFrom ?? [def.figure];
    const matching = part.checks.filter((c) => limitsFrom.includes(c.figure.id) && !c.change);
    // files in mixed-mode order hold modes: only mixed-mode items can be drawn from them, never single-ended names
    const items = itemsFor(def, fig, matching, ports).filter((i) => !units[0].mixedModeOrder || i.params.every((p) => p.mode !== undefined));
    // noise figures sit on the noise frequencies
    const noisy = fig.grid === 'noise' ? units.filter((u) => u.noise) : [];
    if (fig.grid === 'noise' && !noisy.length) return;
    const [glo, ghi] =
      fig.grid === 'noise'
        ? [
            largest(noisy.map((u) => (u.noise as NonNullable<UnitData['noise']>).freqHz[0])),
            smallest(
              noisy.map((u) => {
                const f = (u.noise as NonNullable<UnitData['noise']>).freqHz;
                return f[f.length - 1];
              }),
            ),
          ]
        : [lo, hi];
    const range = rangeFor(def, part, matching, glo, ghi);
    if (!items.length || !range || !(range[1] > range[0])) return;
    const model = buildOne(part, units, def, fig, items, matching, range, index);
    if (model) out.push(model);
  });
  return out;
}

/** The units' condition groups: one per distinct set of conditions, in first-seen order; one unlabelled group when all agree. */
function conditionGroups(units: readonly UnitData[]): Array<{ label: string; conditions: Readonly<Record<string, string>>; units: UnitData[] }> {
  const groups = new Map<string, { label: string; conditions: Readonly<Record<string, string>>; units: UnitData[] }>();
  for (const u of units) {
    const key = JSON.stringify(Object.entries(u.conditions).sort());
    let g = groups.get(key);
    if (!g) groups.set(key, (g = { label: Object.values(u.conditions).join(', '), conditions: u.conditions, units: [] }));
    g.units.push(u);
  }
  const all = [...groups.values()];
  return all.length > 1 ? all : [{ label: '', conditions: {}, units: [...units] }];
}

/** Series groups given by the caller (a comparison's candidates), each in a colour and dash of its own, named by its label alone. */
export interface OwnGroups {
  readonly groups: ReadonlyArray<{ readonly label: string; readonly units: readonly UnitData[] }>;
}

/** Colour and dash of the i-th of several groups drawn in styles of their own: 16 distinct pairs before any repeats. */
export function groupStyle(i: number): { color: string; dash: readonly number[] } {
  return { color: PALETTE[i % PALETTE.length], dash: DASHES[(i + Math.floor(i / PALETTE.length)) % DASHES.length] };
}

export function buildOne(
  part: NormalizedPart,
  units: readonly UnitData[],
  def: PlotDef,
  fig: FigureDef,
  items: readonly Item[],
  matching: readonly NormalizedCheck[],
  range: [number, number],
  index: number,
  own?: OwnGroups,
): PlotModel | null {
  const [x0, x1] = range;
  const fu = frequencyUnitFor(x1);
  const nominal = matching.find((c) => c.figure.id === fig.id && c.nominal !== null)?.nominal ?? null;
  const groups = own ? own.groups.map((g) => ({ label: g.label, conditions: {}, units: [...g.units] })) : conditionGroups(units);
  // a series: one parameter over the units of one condition group (colour by condition where there are several, dash by parameter)
  const series = groups
    .filter((g) => fig.grid !== 'noise' || g.units.some((u) => u.noise))
    .flatMap((g, gi) =>
      items.map((item, ii) => ({
        label: own ? g.label : g.label ? `${item.label} at ${g.label}` : item.label,
        item,
        group: g,
        color: own ? groupStyle(gi).color : PALETTE[(groups.length > 1 ? gi : ii) % PALETTE.length],
        dash: own ? groupStyle(gi).dash : DASHES[ii % DASHES.length],
        data: g.units.flatMap((u) => {
          const aperture = matching.find((c) => c.figure.id === fig.id)?.aperture ?? 1;
          const t = figureTrace(part, fig, item, u, { aperture, nominal, band: { fromHz: x0, toHz: x1 } });
          return t ? [{ unit: u.unit, freq: t.freqHz, values: t.values }] : [];
        }),
      })),
    );
  const all: number[] = [];
  for (const se of series) for (const d of se.data) d.freq.forEach((f, k) => f >= x0 && f <= x1 && Number.isFinite(d.values[k]) && all.push(d.values[k]));
  if (!all.length) return null;
  const disp = valueDisplay(fig.unit, all);
  const traces: TracePoint[] = [];
  const med: TracePoint[] = [];
  const env: BandPoint[] = [];
  for (const se of series) {
    for (const d of se.data) {
      for (const [f, v] of thin(d.freq, d.values, x0, x1))
        traces.push({ x: f / fu.scale, y: v * disp.scale, item: se.label, trace: `${d.unit} ${se.item.label}` });
    }
    const ref = se.data[0];
    if (!ref) continue;
    const mf: number[] = [],
      mv: number[] = [],
      lo: number[] = [],
      hi: number[] = [];
    ref.freq.forEach((f) => {
      if (f < x0 || f > x1) return;
      // a unit whose grid does not reach f is left out there, never extrapolated
      const vals = se.data
        .filter((d) => f >= d.freq[0] && f <= d.freq[d.freq.length - 1])
        .map((d) => valueAt(d.freq, d.values, f))
        .filter(Number.isFinite);
      if (!vals.length) return;
      mf.push(f);
      mv.push(medianOf(vals));
      lo.push(smallest(vals));
      hi.push(largest(vals));
    });
    for (const [f, v] of thin(mf, mv, x0, x1)) med.push({ x: f / fu.scale, y: v * disp.scale, item: se.label, trace: `median ${se.label}` });
    if (se.data.length > 1) {
      // the spread keeps each column's lowest low and highest high, each at its own point, the other edge interpolated there
      const fa = Float64Array.from(mf),
        la = Float64Array.from(lo),
        ha = Float64Array.from(hi);
      const points = new Map<number, BandPoint>();
      for (const [f] of [...thin(fa, la, x0, x1), ...thin(fa, ha, x0, x1)]) {
        points.set(f, { x: f / fu.scale, lo: valueAt(fa, la, f) * disp.scale, hi: valueAt(fa, ha, f) * disp.scale, item: se.label });
      }
      for (const pt of [...points.values()].sort((a, b) => a.x - b.x)) env.push(pt);
    }
  }
  // limit values, for the domain and the regions
  const limitYs: number[] = [];
  for (const c of matching) {
    const l = c.limit;
    if (!l) continue;
    for (const v of [
      l.max,
      l.min,
      l.nominal !== undefined && l.tolerance !== undefined ? l.nominal - l.tolerance : undefined,
      l.nominal !== undefined && l.tolerance !== undefined ? l.nominal + l.tolerance : undefined,
    ]) {
      if (v !== undefined && Number.isFinite(v)) limitYs.push(v * disp.scale);
    }
  }
  const ys = traces.map((t) => t.y).concat(limitYs);
  let yMin = smallest(ys),
    yMax = largest(ys);
  const span = yMax - yMin || Math.abs(yMax) * 0.1 || 1;
  yMin -= span * 0.08;
  yMax += span * 0.08;
  // a limit shades the forbidden region only where it applies to every series drawn; a limit of some series
  // (one parameter, or the units of one condition) is drawn as an edge in those series' style, never shaded over the others
  const regions: Region[] = [];
  const edges: Edge[] = [];
  const seriesEdges: SeriesEdge[] = [];
  const seriesLimits = new Map<string, { label: string; color: string; dash: readonly number[] }>();
  const appliesTo = (c: NormalizedCheck, se: (typeof series)[number]) =>
    c.items.some((i) => i.label === se.item.label) && (!c.when || Object.entries(c.when).every(([k, v]) => se.group.units.every((u) => u.conditions[k] === v)));
  for (const c of matching) {
    const l = c.limit;
    if (!l) continue;
    const bx0 = Math.max(c.band.fromHz, x0) / fu.scale,
      bx1 = Math.min(c.band.toHz, x1) / fu.scale;
    if (!(bx1 >= bx0)) continue;
    const own = series.filter((se) => appliesTo(c, se));
    if (!own.length) continue;
    const everywhere = own.length === series.length;
    const add = (from: number, to: number, edge: number) => {
      if (everywhere) {
        regions.push({ x0: bx0, x1: bx1, y0: from, y1: to });
        edges.push({ x0: bx0, x1: bx1, y: edge });
      } else {
        const oneItem = new Set(own.map((se) => se.item.label)).size === 1;
        const oneGroup = new Set(own.map((se) => se.group)).size === 1 && groups.length > 1;
        const color = oneGroup ? own[0].color : groups.length === 1 && oneItem ? own[0].color : LIMIT_FILL;
        const dash = oneItem ? own[0].dash : [1, 0];
        const label = `limit ${oneItem ? `for ${own[0].item.label}` : ''}${oneGroup ? ` at ${own[0].group.label}` : ''}`.replace('limit  at', 'limit at');
        seriesEdges.push({ x0: bx0, x1: bx1, y: edge, color, dash });
        seriesLimits.set(label, { label, color, dash });
      }
    };
    if (l.tolerance !== undefined && l.nominal !== undefined) {
      add((l.nominal + l.tolerance) * disp.scale, yMax, (l.nominal + l.tolerance) * disp.scale);
      add(yMin, (l.nominal - l.tolerance) * disp.scale, (l.nominal - l.tolerance) * disp.scale);
    }
    if (l.max !== undefined) add(l.max * disp.scale, yMax, l.max * disp.scale);
    if (l.min !== undefined) add(yMin, l.min * disp.scale, l.min * disp.scale);
  }
  const title = def.title ?? fig.title;
  const limitText = matching
    .filter((c) => c.limit)
    .map((c) => `${c.label} over ${c.band.name}${c.when ? ` (${Object.values(c.when).join(', ')} only)` : ''}`)
    .join('; ');
  const itemText = series.map((se) => se.label).join(', ');
  const serials = new Set(units.map((u) => u.serial ?? u.unit));
  // the axis names what is drawn: the plot's own axis title, else the one label its limits share, else the figure
  const labels = [...new Set(matching.filter((c) => c.figure.id === fig.id).map((c) => c.label))];
  const axis = def.axis ?? (labels.length === 1 ? labels[0] : fig.title);
  return {
    id: `plot-${index + 1}`,
    title,
    description: `${title}: ${fig.title.toLowerCase()} of ${itemText} for ${serials.size} measured unit${serials.size === 1 ? '' : 's'}${units.length > serials.size ? ` (${units.length} measurements)` : ''} from ${trim(x0 / fu.scale)} to ${trim(x1 / fu.scale)} ${fu.unit}${units.length > 1 ? ', with the median drawn bold and the spread of the units shaded' : ''}${limitText ? `; limits: ${limitText}; shaded regions mark values a limit of every trace forbids, and a limit of some traces only is a line in their style` : ''}.`,
    xTitle: `Frequency (${fu.unit})`,
    yTitle: disp.label ? `${axis} (${disp.label})` : axis,
    xDomain: [x0 / fu.scale, x1 / fu.scale],
    yDomain: [yMin, yMax],
    downward: DOWNWARD.has(fig.id),
    items: series.map((se) => se.label),
    traces,
    median: med,
    envelope: env,
    regions,
    edges,
    seriesEdges,
    seriesLimits: [...seriesLimits.values()],
    colors: series.map((se) => se.color),
    dashes: series.map((se) => se.dash),
    unitCount: serials.size,
    measurementCount: units.length,
  };
}

/**
 * Plot points of one trace, thinned for drawing: the x range is cut into
 * `buckets` columns and each keeps its lowest and highest point (in x order),
 * plus the first and last point of the range, so every peak and notch
 * survives while a 1,601-point trace draws as at most 2·buckets + 2 points.
 * The figures themselves use every point.
 */
export function thin(xs: ArrayLike<number>, ys: ArrayLike<number>, x0: number, x1: number, buckets = PLOT_BUCKETS): Array<[number, number]> {
  const keep: number[] = [];
  const width = (x1 - x0) / buckets || 1;
  let b = -1,
    lo = -1,
    hi = -1,
    first = -1,
    last = -1;
  const flush = () => {
    if (lo < 0) return;
    if (lo === hi) keep.push(lo);
    else keep.push(Math.min(lo, hi), Math.max(lo, hi));
  };
  for (let k = 0; k < xs.length; k++) {
    const x = xs[k],
      y = ys[k];
    if (x < x0 || x > x1 || !Number.isFinite(y)) continue;
    if (first < 0) first = k;
    last = k;
    const nb = Math.min(buckets - 1, Math.floor((x - x0) / width));
    if (nb !== b) {
      flush();
      b = nb;
      lo = hi = k;
    } else {
      if (y < ys[lo]) lo = k;
      if (y > ys[hi]) hi = k;
    }
  }
  flush();
  if (first >= 0 && keep[0] !== first) keep.unshift(first);
  if (last >= 0 && keep[keep.length - 1] !== last) keep.push(last);
  return keep.map((k) => [xs[k], ys[k]]);
}

/** Columns of a plot's x range for thinning: about two per pixel of its 620 px width would be more than the eye sees. */
export const PLOT_BUCKETS = 200;

function trim(v: number): string {
  return String(Number(v.toPrecision(6)));
}
