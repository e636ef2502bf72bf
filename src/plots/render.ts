/**
 * Vega-Lite → SVG at build time, in Node, with no canvas and no script in the
 * page: compile the spec to Vega, run a headless View, and write SVG with a
 * <title> and <desc> for screen readers. Compiled Vega specs are cached by
 * shape (see below), so charts alike in form compile once.
 */
import { escapeMarkup } from '../format/escape.js';
import * as vega from 'vega';
import { compile } from 'vega-lite';
import type { PlotModel } from './model.js';
import { plotData, shapeOf, specOf, textsOf, type PlotShape } from './spec.js';

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

/*
 * Compiling Vega-Lite costs more than drawing a chart, so each shape compiles
 * once, with sentinel texts and domains that are then replaced in the compiled
 * Vega JSON for every plot (strings as JSON strings, numbers by their text).
 */
const SENTINEL = { x0: 9.87654321e-13, x1: 1.23456789e13, y0: -8.7654321e-13, y1: 2.3456789e13 };
/** Dash patterns are arrays of numbers: [DASH_SENTINEL + i, 1] stands for item i's until it is replaced. */
const DASH_SENTINEL = 987_650;
const compiled = new Map<string, string>();

function compiledTemplate(shape: PlotShape): string {
  const key = JSON.stringify(shape);
  let text = compiled.get(key);
  if (!text) {
    const items = Array.from({ length: shape.itemCount }, (_, i) => `@@item${i}@@`);
    const colors = items.map((_, i) => `@@color${i}@@`);
    const dashes = items.map((_, i) => [DASH_SENTINEL + i, 1]);
    const vl = specOf(shape, {
      title: '@@title@@',
      xTitle: '@@xTitle@@',
      yTitle: '@@yTitle@@',
      xDomain: [SENTINEL.x0, SENTINEL.x1],
      yDomain: [SENTINEL.y0, SENTINEL.y1],
      items,
      colors,
      dashes,
    });
    text = JSON.stringify(compile(vl as never, { logger: silent }).spec);
    compiled.set(key, text);
  }
  return text;
}

function vegaSpecFor(m: PlotModel): vega.Spec {
  const t = textsOf(m);
  const str = (v: string) => JSON.stringify(v).slice(1, -1);
  let text = compiledTemplate(shapeOf(m))
    .replaceAll('@@title@@', str(t.title))
    .replaceAll('@@xTitle@@', str(t.xTitle))
    .replaceAll('@@yTitle@@', str(t.yTitle))
    .replaceAll(String(SENTINEL.x0), String(t.xDomain[0]))
    .replaceAll(String(SENTINEL.x1), String(t.xDomain[1]))
    .replaceAll(String(SENTINEL.y0), String(t.yDomain[0]))
    .replaceAll(String(SENTINEL.y1), String(t.yDomain[1]));
  t.items.forEach((item, i) => {
    text = text
      .replaceAll(`@@item${i}@@`, str(item))
      .replaceAll(`@@color${i}@@`, str(t.colors[i]))
      .replaceAll(`[${DASH_SENTINEL + i},1]`, JSON.stringify(t.dashes[i]));
  });
  return JSON.parse(text) as vega.Spec;
}

/**
 * Vega numbers its clip paths with a counter per process, so two plots on one
 * page (drawn in different threads) could share an id. Each plot's ids are
 * renumbered from 1 under its own prefix, which also makes the SVG the same
 * whichever thread drew it.
 */
function localIds(svg: string, prefix: string): string {
  const seen = new Map<string, string>();
  const local = (n: string) => {
    let v = seen.get(n);
    if (!v) seen.set(n, (v = `${prefix}-clip${seen.size + 1}`));
    return v;
  };
  return svg.replace(/id="clip(\d+)"/g, (_, n: string) => `id="${local(n)}"`).replace(/url\(#clip(\d+)\)/g, (_, n: string) => `url(#${local(n)})`);
}

/*
 * Parsing a Vega spec and building its dataflow costs more than drawing: each
 * shape's compiled spec has its texts, domains, items, colours and dashes
 * turned into signals and is parsed once; each plot gets a fresh View of that
 * runtime with its signals and data (a kept View would keep its earlier
 * layout). A shape whose spec does not take the signals cleanly is drawn the
 * old way, from a spec of its own.
 */
const SIGNALS = ['sb_title', 'sb_xTitle', 'sb_yTitle', 'sb_xDomain', 'sb_yDomain', 'sb_items', 'sb_colors', 'sb_dashes'] as const;

function signalSpec(shape: PlotShape): vega.Spec | null {
  const n = shape.itemCount;
  const list = (f: (i: number) => string) => `[${Array.from({ length: n }, (_, i) => f(i)).join(',')}]`;
  let text = compiledTemplate(shape)
    .replaceAll('"@@title@@"', '{"signal":"sb_title"}')
    .replaceAll('"@@xTitle@@"', '{"signal":"sb_xTitle"}')
    .replaceAll('"@@yTitle@@"', '{"signal":"sb_yTitle"}')
    .replaceAll(`[${SENTINEL.x0},${SENTINEL.x1}]`, '{"signal":"sb_xDomain"}')
    .replaceAll(`[${SENTINEL.y0},${SENTINEL.y1}]`, '{"signal":"sb_yDomain"}');
  if (n > 0) {
    text = text
      .replaceAll(
        list((i) => `"@@item${i}@@"`),
        '{"signal":"sb_items"}',
      )
      .replaceAll(
        list((i) => `"@@color${i}@@"`),
        '{"signal":"sb_colors"}',
      )
      .replaceAll(
        list((i) => `[${DASH_SENTINEL + i},1]`),
        '{"signal":"sb_dashes"}',
      );
  }
  if (/@@|987654321|12345678900000|23456789000000|98765\d/.test(text)) return null;
  const spec = JSON.parse(text) as vega.Spec & { signals?: object[] };
  spec.signals = [...(spec.signals ?? []), ...SIGNALS.map((name) => ({ name, value: null }))];
  return spec;
}

const runtimes = new Map<string, vega.Runtime | null>();

/** The parsed runtime of a shape's signal spec (parsed once), or null when the shape takes no signals. */
function runtimeFor(shape: PlotShape): vega.Runtime | null {
  const key = JSON.stringify(shape);
  if (!runtimes.has(key)) {
    const spec = signalSpec(shape);
    runtimes.set(key, spec ? vega.parse(spec) : null);
  }
  return runtimes.get(key) ?? null;
}

async function drawSvg(m: PlotModel): Promise<string> {
  const runtime = runtimeFor(shapeOf(m));
  const t = textsOf(m);
  // a fresh view of the parsed runtime: the same layout as a view of its own spec, without parsing one per plot
  const view = runtime
    ? new vega.View(runtime, { renderer: 'none' })
        .signal('sb_title', t.title)
        .signal('sb_xTitle', t.xTitle)
        .signal('sb_yTitle', t.yTitle)
        .signal('sb_xDomain', [...t.xDomain])
        .signal('sb_yDomain', [...t.yDomain])
        .signal('sb_items', [...t.items])
        .signal('sb_colors', [...t.colors])
        .signal(
          'sb_dashes',
          t.dashes.map((d) => [...d]),
        )
    : new vega.View(vega.parse(vegaSpecFor(m)), { renderer: 'none' });
  for (const [name, rows] of Object.entries(plotData(m))) view.data(name, rows as object[]);
  await view.runAsync();
  const svg = await view.toSVG();
  view.finalize();
  return svg;
}

/** Renders one plot to an SVG string with role="img", <title> and <desc>. */
export async function renderPlot(m: PlotModel, idPrefix = ''): Promise<string> {
  const svg = await drawSvg(m);
  const id = `${idPrefix}${m.id}`;
  return localIds(svg, id)
    .replace(/^<svg /, `<svg role="img" aria-labelledby="${id}-title ${id}-desc" data-plot="${escapeMarkup(m.id)}" `)
    .replace(/(<svg[^>]*>)/, `$1<title id="${id}-title">${escapeMarkup(m.title)}</title><desc id="${id}-desc">${escapeMarkup(m.description)}</desc>`);
}
