/** Plot models → the SVG blocks pages place (drawn in the worker pool), with their legends. */
import type { PlotModel } from '../plots/model.js';
import { renderPlotAnywhere } from '../plots/pool.js';
import type { PlotBlock } from '../model/catalog.js';

/** Every model drawn, in order; `prefix` keeps the SVGs' element ids apart on one page. */
export async function plotBlocks(models: readonly PlotModel[], prefix: string): Promise<PlotBlock[]> {
  const svgs = await Promise.all(models.map((m) => renderPlotAnywhere(m, prefix)));
  return models.map((m, i) => ({
    id: m.id,
    kind: m.kind ?? 'figure',
    title: m.title,
    svg: svgs[i],
    legend: m.items.map((label, j) => ({ label, color: m.colors[j], dash: m.dashes[j].join(' ') })),
    limitLegend: m.seriesLimits.map((l) => ({ label: l.label, color: l.color, dash: l.dash.join(' ') })),
    unitCount: m.unitCount,
    measurementCount: m.measurementCount,
    hasLimits: m.regions.length > 0,
  }));
}
