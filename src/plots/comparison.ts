/**
 * The plots of a comparison: the class's plots (or one per trace figure of
 * the requirement), one per parameter, each candidate a series of its own
 * colour and dash (kept in the table and the legend, so it survives greyscale
 * printing): a multi-unit candidate drawn as its median with its spread, the
 * requirement's forbidden regions shaded as on datasheets. Then, against a
 * baseline, one plot per difference trace (compare/explain.ts).
 */
import type { CandidateResult } from '../compare/compare.js';
import type { CandidateDifference } from '../compare/explain.js';
import { largest, smallest } from '../evaluate/stats.js';
import { frequencyUnitFor } from '../format/units.js';
import type { NormalizedPart } from '../part-file/normalize.js';
import { buildOne, figureFor, groupStyle, itemsFor, plotDefs, rangeFor, SMITH, thin, valueDisplay, type PlotModel, type TracePoint } from './model.js';

export function comparisonPlots(requirement: NormalizedPart, results: readonly CandidateResult[]): PlotModel[] {
  const withData = results.filter((c) => c.units.length);
  const all = withData.flatMap((c) => c.units);
  if (!all.length) return [];
  const lo = smallest(all.map((u) => u.network.freqHz[0]));
  const hi = largest(all.map((u) => u.network.freqHz[u.network.freqHz.length - 1]));
  const ports = Math.min(...all.map((u) => u.network.ports));
  // every candidate keeps its style (by its place in the comparison) whether or not it has data in a plot
  const groups = results.map((c) => ({ label: c.label, units: c.units }));
  const out: PlotModel[] = [];
  plotDefs(requirement).forEach((def) => {
    if (def.figure === SMITH) return;
    const fig = figureFor(requirement, def.figure);
    if (!fig || fig.shape !== 'trace' || !fig.perPoint || fig.grid === 'noise') return;
    const limitsFrom = def.limitsFrom ?? [def.figure];
    const matching = requirement.checks.filter((c) => limitsFrom.includes(c.figure.id));
    const range = rangeFor(def, requirement, matching, lo, hi);
    if (!range || !(range[1] > range[0])) return;
    const items = itemsFor(def, fig, matching, ports);
    for (const item of items) {
      const title = `${def.title ?? fig.title}, ${item.label}`;
      const model = buildOne(requirement, all, { ...def, title }, fig, [item], matching, range, out.length, { groups });
      if (model)
        out.push({
          ...model,
          id: `plot-${out.length + 1}`,
          description: model.description.replace(
            / for \d+ measured units?( \(\d+ measurements\))?/,
            ` for ${results.length} candidates (${all.length} measured units)`,
          ),
        });
    }
  });
  return out;
}

/** One plot per difference trace: each candidate minus the baseline, in the candidate's style (the y axis always takes in 0, where they agree). */
export function differencePlots(
  requirement: NormalizedPart,
  results: readonly CandidateResult[],
  differences: readonly CandidateDifference[],
  baseline: string,
  firstIndex: number,
): PlotModel[] {
  const keys = [...new Map(differences.flatMap((d) => d.traces.map((t) => [`${t.figure} ${t.item} ${t.band}`, t]))).values()];
  return keys.flatMap((key, k) => {
    const rows = differences.flatMap((d) => {
      const t = d.traces.find((x) => x.figure === key.figure && x.item === key.item && x.band === key.band);
      return t ? [{ label: d.label, style: groupStyle(results.findIndex((c) => c.label === d.label)), trace: t.trace }] : [];
    });
    if (!rows.length) return [];
    const x0 = smallest(rows.map((r) => r.trace.freqHz[0])),
      x1 = largest(rows.map((r) => r.trace.freqHz[r.trace.freqHz.length - 1]));
    if (!(x1 > x0)) return [];
    const fu = frequencyUnitFor(x1);
    const fig = figureFor(requirement, key.figure);
    const disp = valueDisplay(
      key.unit,
      rows.flatMap((r) => Array.from(r.trace.values)),
    );
    const median: TracePoint[] = rows.flatMap((r) =>
      thin(r.trace.freqHz, r.trace.values, x0, x1).map(([f, v]) => ({ x: f / fu.scale, y: v * disp.scale, item: r.label, trace: r.label })),
    );
    const ys = median.map((p) => p.y).concat(0);
    let yMin = smallest(ys),
      yMax = largest(ys);
    const span = yMax - yMin || Math.abs(yMax) * 0.1 || 1;
    yMin -= span * 0.1;
    yMax += span * 0.1;
    const name = fig?.title ?? key.figure;
    const title = `${name}, ${key.item}, over ${key.band}: difference from ${baseline}`;
    return [
      {
        id: `plot-${firstIndex + k + 1}`,
        title,
        description: `${title}: each candidate's median ${name.toLowerCase()} minus ${baseline}'s, on the points of both grids inside the overlap of their data and the band (linear between points), for ${rows.map((r) => r.label).join(', ')}.`,
        xTitle: `Frequency (${fu.unit})`,
        yTitle: `Δ ${name}${disp.label ? ` (${disp.label})` : ''}`,
        xDomain: [x0 / fu.scale, x1 / fu.scale] as const,
        yDomain: [yMin, yMax] as const,
        downward: false,
        items: rows.map((r) => r.label),
        traces: [],
        median,
        envelope: [],
        regions: [],
        edges: [],
        seriesEdges: [],
        seriesLimits: [],
        colors: rows.map((r) => r.style.color),
        dashes: rows.map((r) => r.style.dash),
        unitCount: rows.length,
        measurementCount: 1,
      } satisfies PlotModel,
    ];
  });
}
