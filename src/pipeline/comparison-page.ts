/**
 * A comparison's page model: the requirement, the side-by-side table (best
 * value per row marked, failing cells marked in words and by a sign, not by
 * colour alone), the ranking with its reasons, the differences from the
 * baseline, the overlay and difference plots as SVG, and each candidate's
 * provenance. Formatted for the template, which only places it.
 */
import { relative } from 'node:path';
import { bandGaps, bestMargin, gapText } from '../compare/explain.js';
import { comparisonJson } from '../compare/json.js';
import { classOf } from '../classes/registry.js';
import { bandRange, coarsestResolutionHz, trimNumber } from '../format/units.js';
import { formatLimit, formatValue } from '../format/values.js';
import { comparisonPlots, differencePlots } from '../plots/comparison.js';
import { groupStyle } from '../plots/model.js';
import type { ComparisonOutcome } from './comparison.js';
import { plotBlocks } from './plot-blocks.js';
import { inputsOf } from './inputs.js';
import type { ComparisonCandidate, ComparisonCell, ComparisonPage } from '../model/catalog.js';

const ohms = (v: number) => `${trimNumber(v)} Ω`;

/** The page of one evaluated comparison (outcome.errors empty). */
export async function buildComparisonPage(outcome: ComparisonOutcome, slug: string, contentRoot: string, file: string): Promise<ComparisonPage> {
  const cmp = outcome.comparison as NonNullable<ComparisonOutcome['comparison']>;
  const req = cmp.requirement;
  const results = outcome.results;
  const resolution = coarsestResolutionHz(results.flatMap((c) => c.units.map((u) => u.network.freqHz)));
  const rows = req.checks.map((check, i) => {
    const best = bestMargin(results, i);
    return {
      label: check.label,
      on: check.on.join(', '),
      band: check.band.name,
      limit: formatLimit(check.limit, check.figure.unit),
      cells: results.map((c): ComparisonCell => {
        const r = c.byCheck[i];
        if (!r) return { text: 'no data', value: null, margin: '', verdict: 'NO DATA', best: false };
        return {
          text: formatValue(r.worst, r.unit, resolution),
          value: Number.isFinite(r.worst) ? r.worst : null,
          margin: formatValue(r.margin, r.unit, resolution),
          verdict: r.pass === false ? 'FAIL' : 'PASS',
          best: best !== null && r.margin === best,
        };
      }),
    };
  });
  const reasonOf = new Map(results.map((c, i) => [c.label, outcome.reasons[i]]));
  const ranked = results.filter((c) => c.rank !== null).sort((a, b) => (a.rank as number) - (b.rank as number));
  const ranking = [...ranked, ...results.filter((c) => c.rank === null)].map((c) => ({
    rank: c.rank === null ? '—' : String(c.rank),
    label: c.label,
    reason: reasonOf.get(c.label) ?? '',
  }));
  const candidates = outcome.candidates.map((lc, i): ComparisonCandidate => {
    const c = results[i];
    const style = groupStyle(i);
    const refs = new Set(lc.units.flatMap((u) => Array.from(u.network.z0)));
    const renormalized = [...refs].some((z) => z !== cmp.referenceOhms)
      ? `renormalized from ${[...refs].map(ohms).join(' / ')} to ${ohms(cmp.referenceOhms)}`
      : '';
    return {
      label: c.label,
      vendor: lc.spec.vendor ?? lc.part?.vendor ?? '',
      notes: lc.spec.notes ?? '',
      color: style.color,
      dash: style.dash.join(' '),
      rank: c.rank,
      pass: c.pass,
      coverage: c.coverage,
      verdict: c.coverage === 'partial' ? 'NOT RANKED: partial data' : c.pass ? 'PASS' : 'FAIL',
      reason: reasonOf.get(c.label) ?? '',
      gaps: bandGaps(c).map(gapText),
      source: lc.part
        ? `catalog part ${lc.part.part}${lc.part.revision ? `, revision ${lc.part.revision}` : ''} (${lc.spec.source.kind === 'part' ? lc.spec.source.path : ''})`
        : `Touchstone file${lc.units.length === 1 ? '' : 's'}`,
      portMap: lc.spec.portMap ? lc.spec.portMap.map((p, k) => `our port ${k + 1} = file port ${p}`).join(', ') : '',
      renormalized,
      units: lc.units.map((u) => {
        const net = u.network,
          k = net.freqHz.length;
        const uniform = net.z0.every((r) => r === net.z0[0]);
        return {
          unit: u.unit,
          file: relative(contentRoot, u.path).split('\\').join('/'),
          sha256: u.sha256,
          points: k,
          range: bandRange(net.freqHz[0], net.freqHz[k - 1]),
          reference: uniform ? ohms(net.z0[0]) : Array.from(net.z0, (r, p) => `${p + 1}: ${ohms(r)}`).join(', '),
          touchstone: `${u.data.info.version}, ${u.data.info.parameter} ${u.data.info.format}`,
        };
      }),
    };
  });
  const baseline = cmp.baseline ?? '';
  const differences = outcome.differences
    ? req.checks.map((check, i) => ({
        label: check.label,
        on: check.on.join(', '),
        band: check.band.name,
        cells: (outcome.differences ?? []).map((d) => {
          const v = d.limits[i].worst;
          return { label: d.label, text: v === null ? 'no data' : `${v > 0 ? '+' : ''}${formatValue(v, check.figure.unit, resolution)}`, value: v };
        }),
      }))
    : [];
  const models = comparisonPlots(req, results);
  const diffModels = outcome.differences && baseline ? differencePlots(req, results, outcome.differences, baseline, models.length) : [];
  const [plots, diffPlots] = await Promise.all([plotBlocks(models, `${slug}-`), plotBlocks(diffModels, `${slug}-`)]);
  return {
    slug,
    url: `comparisons/${slug}/`,
    pdfUrl: null,
    title: cmp.title,
    description: cmp.description ?? '',
    date: cmp.date ?? '',
    classTitle: classOf(req.partClass).title,
    reference: ohms(cmp.referenceOhms),
    bands: [...req.bands.values()].map((b) => ({ name: b.name, range: bandRange(b.fromHz, b.toHz) })),
    requirement: req.checks.map((c) => ({
      label: c.label,
      on: c.on.join(', '),
      band: c.band.name,
      bandRange: bandRange(c.band.fromHz, c.band.toHz),
      limit: formatLimit(c.limit, c.figure.unit),
    })),
    candidates,
    rows,
    ranking,
    baseline,
    differences,
    plots,
    differencePlots: diffPlots,
    warnings: results.flatMap((c) => c.warnings.map((w) => ({ where: c.label, message: w.message }))),
    // safe inside <script type="application/json">: no "<" can close the element
    comparisonJson: JSON.stringify(comparisonJson(cmp.title, cmp.referenceOhms, results)).replace(/</g, '\\u003c'),
    inputs: inputsOf(
      file,
      outcome.candidates.flatMap((lc) => lc.units),
      contentRoot,
    ),
  };
}
