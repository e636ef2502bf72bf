/**
 * The Vega-Lite spec of a Smith chart: a square plot of the Γ plane, the
 * chart's grid in light grey, each trace a line in frequency order (`k`),
 * coloured and dashed per parameter as on the other plots.
 */
import type { PlotShape, PlotTexts } from './spec.js';
import { PLOT_CONFIG, titleOf } from './style.js';

export const SMITH_SIZE = 300;

const R_CIRCLES = [0.2, 0.5, 1, 2, 5];
const X_ARCS = [0.2, 0.5, 1, 2, 5];

/**
 * The chart's grid as polylines: the unit circle, constant-r circles, constant-x arcs clipped to the unit circle. */
export function smithGrid(): Array<{ x: number; y: number; curve: string; k: number }> {
  const out: Array<{ x: number; y: number; curve: string; k: number }> = [];
  const circle = (cx: number, cy: number, r: number, name: string, inside: (x: number, y: number) => boolean) => {
    let k = 0,
      part = 0,
      was = false;
    for (let i = 0; i <= 360; i++) {
      const a = (i * Math.PI) / 180;
      const x = cx + r * Math.cos(a),
        y = cy + r * Math.sin(a);
      const ok = inside(x, y);
      if (ok && !was) part++;
      if (ok) out.push({ x, y, curve: `${name}-${part}`, k: k++ });
      was = ok;
    }
  };
  const all = () => true;
  const inUnit = (x: number, y: number) => x * x + y * y <= 1 + 1e-9;
  circle(0, 0, 1, 'unit', all);
  for (const r of R_CIRCLES) circle(r / (1 + r), 0, 1 / (1 + r), `r${r}`, all);
  for (const x of X_ARCS) for (const s of [1, -1]) circle(1, s / x, 1 / x, `x${s * x}`, inUnit);
  out.push({ x: -1, y: 0, curve: 'axis', k: 0 }, { x: 1, y: 0, curve: 'axis', k: 1 });
  return out;
}

export function smithSpecOf(shape: PlotShape, t: PlotTexts): Record<string, unknown> {
  const axis = (title: string, domain: readonly [number, number]) => ({
    type: 'quantitative',
    title,
    scale: { domain: [...domain], nice: false, zero: false },
    axis: { grid: false, tickCount: 5 },
  });
  const x = { field: 'x', ...axis(t.xTitle, t.xDomain) };
  const y = { field: 'y', ...axis(t.yTitle, t.yDomain) };
  const color = { field: 'item', type: 'nominal', legend: null, scale: { domain: [...t.items], range: [...t.colors] } };
  const dash = { field: 'item', type: 'nominal', legend: null, scale: { domain: [...t.items], range: t.dashes.map((d) => [...d]) } };
  return {
    $schema: 'https://vega.github.io/schema/vega-lite/v6.json',
    width: SMITH_SIZE,
    height: SMITH_SIZE,
    title: titleOf(t.title),
    config: { ...PLOT_CONFIG, view: { stroke: null } },
    layer: [
      {
        name: 'smith_grid',
        data: { name: 'grid' },
        mark: { type: 'line', color: '#c5cad3', strokeWidth: 0.7, clip: true },
        encoding: { x, y, detail: { field: 'curve' }, order: { field: 'k', type: 'quantitative' } },
      },
      {
        name: 'smith_traces',
        data: { name: 'traces' },
        mark: { type: 'line', strokeWidth: shape.several ? 1 : 1.6, clip: true },
        encoding: { x, y, color, strokeDash: dash, detail: { field: 'trace' }, order: { field: 'k', type: 'quantitative' } },
      },
    ],
  };
}
