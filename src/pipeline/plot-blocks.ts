/** Plot models → the SVG blocks pages place (drawn in the worker pool), with their legends. */
import { mkdirSync } from 'node:fs';
import { join } from 'node:path';
import type { PlotModel } from '../plots/model.js';
import { renderPlotAnywhere } from '../plots/pool.js';
import type { PlotBlock } from '../model/catalog.js';

/**
 * Every model drawn, in order; `prefix` keeps the SVGs' element ids apart on one page. With `spill`, each
 * SVG is written by the thread that drew it to `<dir>/<stem>-<plot id>.svg` (the name pipeline/spill.ts
 * gives it) and the block holds the file's path.
 */
export async function plotBlocks(models: readonly PlotModel[], prefix: string, spill?: { readonly dir: string; readonly stem: string }): Promise<PlotBlock[]> {
  if (spill) mkdirSync(spill.dir, { recursive: true });
  const fileOf = (m: PlotModel) => (spill ? join(spill.dir, `${spill.stem}-${m.id}.svg`) : undefined);
  const svgs = await Promise.all(models.map((m) => renderPlotAnywhere(m, prefix, fileOf(m))));
  return models.map((m, i) => ({
    id: m.id,
    kind: m.kind ?? 'figure',
    title: m.title,
    svg: svgs[i],
    ...(spill ? { svgFile: fileOf(m) } : {}),
    legend: m.items.map((label, j) => ({ label, color: m.colors[j], dash: m.dashes[j].join(' ') })),
    limitLegend: m.seriesLimits.map((l) => ({ label: l.label, color: l.color, dash: l.dash.join(' ') })),
    unitCount: m.unitCount,
    measurementCount: m.measurementCount,
    hasLimits: m.regions.length > 0,
  }));
}
