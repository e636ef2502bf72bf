/**
 * PlotModel → a Vega-Lite specification (JSON only; data by name, supplied at
 * render time). Colours are our own: a blue, an ochre, a green and a purple
 * that stay apart for the common colour-vision deficiencies and in greyscale
 * (they differ in lightness, and each parameter has its own dash pattern);
 * forbidden regions are a translucent brick red with a solid edge.
 */
import type { PlotModel } from './model.js';
import { smithGrid, smithSpecOf } from './smith-spec.js';
import { PLOT_CONFIG, titleOf } from './style.js';

export const PALETTE = ['#1f4e8c', '#b5651d', '#2e7d5b', '#6d4a99'] as const;
export const DASHES: ReadonlyArray<readonly number[]> = [
  [1, 0],
  [7, 3],
  [2, 2],
  [9, 3, 2, 3],
];
export const LIMIT_FILL = '#c0392b';
export const ENVELOPE_OPACITY = 0.18;

export const WIDTH = 620;
export const HEIGHT = 250;

/** What varies between plots of one shape: texts and domains. */
export interface PlotTexts {
  readonly title: string;
  readonly xTitle: string;
  readonly yTitle: string;
  readonly xDomain: readonly [number, number];
  readonly yDomain: readonly [number, number];
  readonly items: readonly string[];
  /** Colour and dash pattern per item. */
  readonly colors: readonly string[];
  readonly dashes: ReadonlyArray<readonly number[]>;
}

/** The form of a plot, apart from its texts, domains and data: plots of one shape compile once. */
export interface PlotShape {
  readonly downward: boolean;
  readonly itemCount: number;
  readonly several: boolean;
  /** Limits drawn per series (in the series' style) as well as, or instead of, shaded regions. */
  readonly seriesEdges: boolean;
  readonly smith: boolean;
}

export const shapeOf = (m: PlotModel): PlotShape => ({
  downward: m.downward,
  itemCount: m.items.length,
  several: m.measurementCount > 1,
  seriesEdges: m.seriesEdges.length > 0,
  smith: m.kind === 'smith',
});
export const textsOf = (m: PlotModel): PlotTexts => ({
  title: m.title,
  xTitle: m.xTitle,
  yTitle: m.yTitle,
  xDomain: m.xDomain,
  yDomain: m.yDomain,
  items: m.items,
  colors: m.colors,
  dashes: m.dashes,
});

/** The Vega-Lite spec of a plot. */
export function plotSpec(m: PlotModel): Record<string, unknown> {
  return specOf(shapeOf(m), textsOf(m));
}

export function specOf(shape: PlotShape, t: PlotTexts): Record<string, unknown> {
  if (shape.smith) return smithSpecOf(shape, t);
  const m = { ...t, downward: shape.downward, unitCount: shape.several ? 2 : 1 };
  const x = { field: 'x', type: 'quantitative', title: m.xTitle, scale: { domain: [...m.xDomain], nice: false, zero: false } };
  const y = { field: 'y', type: 'quantitative', title: m.yTitle, scale: { domain: [...m.yDomain], nice: false, zero: false, reverse: m.downward } };
  const color = { field: 'item', type: 'nominal', title: 'Parameter', scale: { domain: [...m.items], range: [...m.colors] } };
  const dash = { field: 'item', type: 'nominal', legend: null, scale: { domain: [...m.items], range: m.dashes.map((d) => [...d]) } };
  const layers: Record<string, unknown>[] = [
    {
      name: 'limit_regions',
      data: { name: 'regions' },
      mark: { type: 'rect', color: LIMIT_FILL, opacity: 0.16, clip: true },
      encoding: { x: { ...x, field: 'x0' }, x2: { field: 'x1' }, y: { ...y, field: 'y0' }, y2: { field: 'y1' } },
    },
  ];
  if (shape.several) {
    layers.push({
      name: 'unit_spread',
      data: { name: 'envelope' },
      mark: { type: 'area', opacity: ENVELOPE_OPACITY, clip: true },
      encoding: { x, y: { ...y, field: 'lo' }, y2: { field: 'hi' }, color: { ...color, legend: null }, detail: { field: 'item' } },
    });
    layers.push({
      name: 'unit_traces',
      data: { name: 'traces' },
      mark: { type: 'line', strokeWidth: 0.8, opacity: 0.55, clip: true },
      encoding: { x, y, color: { ...color, legend: null }, detail: { field: 'trace' } },
    });
  }
  layers.push({
    name: 'median_traces',
    data: { name: 'median' },
    mark: { type: 'line', strokeWidth: shape.several ? 2.2 : 1.6, clip: true },
    encoding: { x, y, color: { ...color, legend: null }, strokeDash: dash },
  });
  layers.push({
    name: 'limit_edges',
    data: { name: 'edges' },
    mark: { type: 'rule', color: LIMIT_FILL, strokeWidth: 1.4, clip: true },
    encoding: { x: { ...x, field: 'x0' }, x2: { field: 'x1' }, y: { ...y, field: 'y' } },
  });
  if (shape.seriesEdges) {
    layers.push({
      name: 'series_limit_edges',
      data: { name: 'seriesEdges' },
      mark: { type: 'rule', strokeWidth: 2.4, clip: true },
      // colour and dash come with each edge (scale null: the values are used as they are)
      encoding: {
        x: { ...x, field: 'x0' },
        x2: { field: 'x1' },
        y: { ...y, field: 'y' },
        color: { field: 'color', type: 'nominal', scale: null, legend: null },
        strokeDash: { field: 'dash', type: 'nominal', scale: null, legend: null },
      },
    });
  }
  return {
    $schema: 'https://vega.github.io/schema/vega-lite/v6.json',
    width: WIDTH,
    height: HEIGHT,
    title: titleOf(m.title),
    config: PLOT_CONFIG,
    resolve: { scale: { color: 'shared', strokeDash: 'shared' } },
    layer: layers,
  };
}

/** The named datasets the spec reads (a plot of one unit has no spread and no per-unit traces beside its median). */
export function plotData(m: PlotModel): Record<string, readonly object[]> {
  const shape = shapeOf(m);
  if (shape.smith) return { grid: smithGrid(), traces: m.traces };
  const own = { regions: m.regions, median: m.median, edges: m.edges, ...(shape.seriesEdges ? { seriesEdges: m.seriesEdges } : {}) };
  return shape.several ? { ...own, envelope: m.envelope, traces: m.traces } : own;
}
