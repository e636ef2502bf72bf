/**
 * Vega-Lite → SVG at build time, in Node, with no canvas and no script in the
 * page: compile the spec to Vega, run a headless View, and write SVG with a
 * <title> and <desc> for screen readers. Compiled Vega specs are cached by
 * the shape of the spec (everything but the data), so charts alike in form
 * compile once.
 */
import * as vega from 'vega';
import { compile } from 'vega-lite';
import type { PlotModel } from './model.js';
import { plotData, plotSpec } from './spec.js';

const compiled = new Map<string, vega.Spec>();

/** Vega-Lite's notes about resolved conflicts are not for datasheet readers; errors still throw. */
const silent = {
  level: () => silent,
  warn: () => silent,
  info: () => silent,
  debug: () => silent,
  error: (...args: unknown[]) => {
    throw new Error(args.map(String).join(' '));
  },
} as never;

function vegaSpecFor(vl: Record<string, unknown>): vega.Spec {
  const key = JSON.stringify(vl);
  let spec = compiled.get(key);
  if (!spec) {
    spec = compile(vl as never, { logger: silent }).spec as vega.Spec;
    compiled.set(key, spec);
  }
  return spec;
}

function escapeXml(s: string): string {
  return s.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;').replace(/"/g, '&quot;');
}

/** Renders one plot to an SVG string with role="img", <title> and <desc>. */
export async function renderPlot(m: PlotModel, idPrefix = ''): Promise<string> {
  const view = new vega.View(vega.parse(vegaSpecFor(plotSpec(m))), { renderer: 'none' });
  for (const [name, rows] of Object.entries(plotData(m))) view.data(name, rows as object[]);
  await view.runAsync();
  const svg = await view.toSVG();
  view.finalize();
  const id = `${idPrefix}${m.id}`;
  return svg.replace(
    /^<svg /,
    `<svg role="img" aria-labelledby="${id}-title ${id}-desc" data-plot="${escapeXml(m.id)}" `,
  ).replace(/(<svg[^>]*>)/, `$1<title id="${id}-title">${escapeXml(m.title)}</title><desc id="${id}-desc">${escapeXml(m.description)}</desc>`);
}
