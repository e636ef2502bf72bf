import { basename, dirname, relative, sep } from 'node:path';
import type { CheckResult } from '../evaluate/evaluate.js';
import { figuresJson } from '../evaluate/json.js';
import { largest, smallest } from '../evaluate/stats.js';
import { bandRange, coarsestResolutionHz, formatFrequency, trimNumber } from '../format/units.js';
import { formatLimit, formatStages, formatValue, type Cell } from '../format/values.js';
import { composeDisclaimer, conditionText, specification } from './specification.js';
import { ieee370Quality } from '../network/ieee370.js';
import { passivity, reciprocity } from '../network/quality.js';
import { classOf } from '../classes/registry.js';
import { buildPlots } from '../plots/model.js';
import { plotBlocks } from './plot-blocks.js';
import { formatSpecError, type SpecError } from '../part-file/diagnostics.js';
import { whereOf } from '../format/where.js';
import type { NormalizedPart } from '../part-file/normalize.js';
import { cautionsFor } from '../classes/cautions.js';
import { renderMarkdown } from '../format/markdown.js';
import { assetPathProblem, type SiteSettings } from '../site-file/settings.js';
import { contentFile } from './catalog.js';
import { contentPath, inputsOf } from './inputs.js';
import { evaluatePartFile, type LoadedUnit, type StageTimes } from './part.js';
import { lotStatistics, stripSvg, type LotGroup } from '../archive/lot.js';
import { medianNetwork, medianTouchstone } from '../archive/exports.js';
import { sha256File } from '../io/hash.js';
import { partFileStem } from '../pdf/jobs.js';
import { recordedFigures } from '../archive/release.js';
import { history, readReleases, releaseProblem } from '../archive/releases.js';
import type { ComplianceRow, LotRow, MeasurementRow, PartFailure, PartPage, QualityRow } from '../model/catalog.js';

const cell = (v: number | null, unit: string, resolutionHz: number | null = null): Cell => ({
  text: formatValue(v, unit, resolutionHz),
  value: v !== null && Number.isFinite(v) ? v : null,
});
const atCell = (hz: number | null): Cell => ({ text: hz === null ? '—' : formatFrequency(hz), value: hz });
const verdictOf = (pass: boolean | null): 'PASS' | 'FAIL' | 'REPORT' => (pass === null ? 'REPORT' : pass ? 'PASS' : 'FAIL');

function complianceRow(r: CheckResult, res: number | null): ComplianceRow {
  return {
    label: r.label,
    figure: r.figure,
    on: r.on.join(', '),
    band: r.band,
    bandRange: bandRange(r.fromHz, r.toHz),
    limit: formatLimit(r.limit, r.unit),
    typical: cell(r.typical, r.unit, res),
    worst: cell(r.worst, r.unit, res),
    worstUnit: r.worstUnit,
    at: atCell(r.worstAtHz),
    margin: cell(r.margin, r.unit, res),
    verdict: verdictOf(r.pass),
    stages: r.change ? formatStages(r.change) : '',
    units: r.units.map((u) => ({
      unit: u.unit,
      worst: cell(u.worst, r.unit, res),
      at: atCell(u.atHz),
      margin: cell(u.margin, r.unit, res),
      verdict: verdictOf(u.pass),
    })),
  };
}

function lotRows(part: NormalizedPart, results: readonly CheckResult[], units: readonly LoadedUnit[], res: number | null): LotRow[] {
  const lotOf = new Map(part.measurements.map((m) => [m.label, m.lot]));
  const conditionsOf = new Map(units.map((u) => [u.unit, u.conditions]));
  const serialOf = new Map(units.map((u) => [u.unit, u.serial]));
  return results
    .filter((r) => r.limit)
    .map((r) => {
      const s = lotStatistics(r, (unit) => ({
        serial: serialOf.get(unit) ?? unit,
        lot: lotOf.get(unit) ?? null,
        conditions: r.change ? {} : (conditionsOf.get(unit) ?? {}),
      }));
      const f = (v: number | null) => formatValue(v, r.unit, res);
      const row = (g: LotGroup) => ({
        label: g.label || 'all units',
        count: g.summary.count,
        mean: f(g.summary.mean),
        std: g.summary.std === null ? '—' : f(g.summary.std),
        min: f(g.summary.min),
        max: f(g.summary.max),
        cpk: g.summary.cpk === null ? `— (${g.summary.cpkNote})` : g.summary.cpk.toFixed(2),
        worst: f(g.worst),
      });
      return {
        label: r.label,
        on: r.on.join(', '),
        band: r.band,
        stages: r.change ? formatStages(r.change) : '',
        groups: [s.all, ...s.lots, ...s.conditions].map(row),
        units: s.all.summary.count,
        conditionSpread: s.conditionSpread === null ? '' : f(s.conditionSpread),
        strip: stripSvg(s.allWorsts, r.limit, r.unit === 's' ? 1e9 : 1),
      };
    });
}

function quality(part: NormalizedPart, u: LoadedUnit): QualityRow {
  const net = u.network;
  const p = passivity(net);
  const q = ieee370Quality(net, p.perFrequency);
  const metric = (m: { score: number; grade: string } | null) => (m ? `${trimNumber(m.score, 4)} (${m.grade})` : 'n/a');
  const cls = classOf(part.partClass);
  const active = !cls.passive;
  const ferrite = !cls.reciprocal && cls.passive;
  let flag: string | null = null;
  let passText = `largest singular value ${trimNumber(p.max, 5)} at ${formatFrequency(p.atHz)}`;
  if (active) passText += ': does not apply to an active part';
  else if (!p.passive) {
    passText += ': NOT PASSIVE';
    flag = 'The data of this passive part show gain: check the calibration and the measurement.';
  } else passText += ': passive';
  let recText: string;
  if (net.ports < 2) recText = 'does not apply to a 1-port';
  else {
    const r = reciprocity(net);
    recText = `largest |Sij − Sji| ${trimNumber(r.maxDeviation, 3)}`;
    if (ferrite) recText += r.reciprocal ? ': reciprocal, which a ferrite part should not be' : ': not reciprocal, as a ferrite part should be';
    else if (active) recText += ': does not apply to an active part';
    else if (!r.reciprocal) {
      recText += ': NOT RECIPROCAL';
      flag ??= 'The data of this reciprocal part are not reciprocal: check the measurement.';
    } else recText += ': reciprocal';
    if (ferrite && r.reciprocal) flag ??= 'A non-reciprocal part measured as reciprocal: check the measurement.';
  }
  return {
    unit: u.unit,
    passivity: passText,
    reciprocity: recText,
    ieee370: `passivity ${metric(q.passivity)}, reciprocity ${metric(q.reciprocity)}, causality ${metric(q.causality)}`,
    flag,
  };
}

function measurement(u: LoadedUnit, m: NormalizedPart['measurements'][number] | undefined): MeasurementRow {
  const net = u.network;
  const k = net.freqHz.length;
  const uniform = net.z0.every((r) => r === net.z0[0]);
  return {
    unit: u.unit,
    conditions:
      Object.entries(u.conditions)
        .map(([key, v]) => `${key}: ${v}`)
        .join(', ') || '—',
    file: u.file,
    sha256: u.sha256,
    points: k,
    range: bandRange(net.freqHz[0], net.freqHz[k - 1]),
    reference: uniform ? `${trimNumber(net.z0[0])} Ω` : Array.from(net.z0, (r, i) => `${i + 1}: ${trimNumber(r)} Ω`).join(', '),
    touchstone: `${u.data.info.version}, ${u.data.info.parameter} ${u.data.info.format}`,
    notes: m?.notes ?? '',
    instrument: m?.instrument ?? '',
    calibration: m?.calibration ?? '',
    measuredOn: m?.date ?? '',
    operator: m?.operator ?? '',
    fileLines: [...u.data.info.comments, ...u.data.info.information]
      .map((l) => l.trim())
      .filter(Boolean)
      .slice(0, 12),
  };
}

/** "Z0 = 50 Ω" when every port of every unit has one reference, else each port's. */
function referenceText(units: readonly LoadedUnit[]): string {
  const all = new Set(units.flatMap((u) => Array.from(u.network.z0)));
  if (all.size === 1) return `Z0 = ${trimNumber([...all][0])} Ω`;
  const first = units[0]?.network.z0;
  return first ? `Z0 = ${Array.from(first, (r) => `${trimNumber(r)}`).join(' / ')} Ω` : '';
}

export interface PartBuild {
  readonly page: PartPage | null;
  readonly failure: PartFailure | null;
}

/** Builds one part's page model; errors come back as a failure, never thrown. */
export async function buildPartPage(
  partFile: string,
  contentRoot: string,
  slug: string,
  settings: SiteSettings,
  times?: StageTimes,
  /** The build's folder for page texts (pipeline/spill.ts): the plot workers write the SVGs there themselves. */
  spillDir?: string | null,
): Promise<PartBuild> {
  const display = relative(process.cwd(), partFile) || partFile;
  const outcome = await evaluatePartFile(partFile, contentRoot, display, times);
  if (!outcome.result || !outcome.part) {
    return {
      page: null,
      failure: { slug, file: display, messages: outcome.errors.map((e: SpecError) => formatSpecError(e, e.file === display ? outcome.source : undefined)) },
    };
  }
  const part = outcome.part;
  const result = outcome.result;
  const outlineProblem = part.outline ? assetPathProblem('outline', part.outline, contentFile(contentRoot)) : null;
  if (outlineProblem) {
    return {
      page: null,
      failure: {
        slug,
        file: display,
        messages: [formatSpecError({ code: 'missing-file', file: display, message: outlineProblem, ...part.outlineAt }, outcome.source)],
      },
    };
  }
  const partDir = dirname(partFile);
  const releases = readReleases(partDir, (f) => relative(process.cwd(), f) || f);
  const rel = (path: string) => relative(partDir, path).split(sep).join('/');
  const problem =
    releases.errors[0] ??
    releaseProblem(
      releases.records,
      part.revision,
      { path: 'part.yaml', sha256: sha256File(partFile) },
      outcome.units.map((u) => ({ path: rel(u.path), sha256: u.sha256 })),
      { file: display, ...(part.revisionAt.line ? part.revisionAt : { line: 0, column: 0 }) },
    );
  if (problem)
    return { page: null, failure: { slug, file: display, messages: [formatSpecError(problem, problem.file === display ? outcome.source : undefined)] } };
  const past = history(releases.records, { revision: part.revision, date: part.date ?? '', figures: recordedFigures(result.results) }, slug, partDir);
  const tp = performance.now();
  const plots = await plotBlocks(buildPlots(part, outcome.units), `${slug}-`, spillDir ? { dir: spillDir, stem: slug } : undefined);
  if (times) times.plots += performance.now() - tp;
  const lo = largest(outcome.units.map((u) => u.network.freqHz[0]));
  const hi = smallest(outcome.units.map((u) => u.network.freqHz[u.network.freqHz.length - 1]));
  const operating = part.operatingBand ?? defaultOperatingBand(part);
  // frequency figures are shown to the resolution the coarsest measured grid supports
  const resolution = coarsestResolutionHz(outcome.units.map((u) => u.network.freqHz));
  const seen = new Set<string>();
  const dataFiles = settings.publishData
    ? outcome.units.map((u) => {
        let name = basename(u.path);
        if (seen.has(name)) name = `${(u.serial ?? u.unit).replace(/[^A-Za-z0-9._-]+/g, '_')}-${name}`;
        seen.add(name);
        return { unit: u.unit, from: relative(contentRoot, u.path).split(sep).join('/'), url: `parts/${slug}/data/${name}`, name };
      })
    : [];
  const page: PartPage = {
    slug,
    url: `parts/${slug}/`,
    pdfUrl: null,
    reportUrl: settings.reports ? `parts/${slug}/report.html` : null,
    reportPdfUrl: null,
    operatingBand: operating ? bandRange(operating.fromHz, operating.toHz) : '',
    features: part.features,
    weight: part.weight ?? '',
    outline: part.outline ?? '',
    ordering: part.ordering,
    dataFiles,
    unitCount: new Set(outcome.units.map((u) => u.serial)).size,
    part: part.part,
    title: part.title,
    partClass: part.partClass,
    revision: part.revision,
    date: part.date ?? '',
    vendor: part.vendor ?? settings.vendor,
    description: part.description ?? '',
    notesHtml: part.notes ? renderMarkdown(part.notes) : '',
    packageText: part.packageText ?? '',
    connector: part.connector ?? '',
    operatingTemperature: part.operatingTemperature ?? '',
    ports: Array.from({ length: outcome.units[0]?.network.ports ?? 0 }, (_, i) => ({ number: i + 1, name: part.portNames[i + 1] ?? `Port ${i + 1}` })),
    pass: result.pass,
    frequencyRange: bandRange(lo, hi),
    specification: specification(part, result.results, referenceText(outcome.units), resolution),
    typicalConditions: part.typicalAt ? conditionText(part.typicalAt) : '',
    disclaimer: settings.disclaimer ?? composeDisclaimer(result.results, part.declared.length > 0),
    compliance: result.results.map((r) => complianceRow(r, resolution)),
    plots,
    measurements: outcome.units.map((u, i) => measurement(u, part.measurements[i])),
    quality: outcome.units.map((u) => quality(part, u)),
    lots: lotRows(part, result.results, outcome.units, resolution),
    ratings: part.ratings.map((r) => ({ parameter: r.parameter, value: r.value, notes: r.notes ?? '' })),
    cautions: cautionsFor(part.partClass, part.cautions),
    warnings: result.warnings.map((w) => ({ where: whereOf(w.file, w.line, w.column), message: w.message, fromFile: w.code === 'touchstone' })),
    // safe inside <script type="application/json">: no "<" can close the element
    figuresJson: JSON.stringify(figuresJson(result)).replace(/</g, '\\u003c'),
    inputs: inputsOf(partFile, outcome.units, contentRoot),
    exports: exportsOf(part, slug, outcome.units),
    history: past.rows,
    releasedFiles: past.files.map((f) => ({ from: contentPath(contentRoot, f.from), url: f.url })),
  };
  return { page, failure: null };
}

function exportsOf(part: NormalizedPart, slug: string, units: readonly LoadedUnit[]): PartPage['exports'] {
  const json = `parts/${slug}/figures.json`,
    csv = `parts/${slug}/figures.csv`;
  if (units.some((u) => u.mixedModeOrder)) return { json, csv, median: null, noMedian: 'the files are in mixed-mode order' };
  // with typical-at, the median is of the measurements typical values are quoted at
  const at = part.typicalAt;
  const chosen =
    at && units.some((u) => Object.entries(at).every(([k, v]) => u.conditions[k] === v))
      ? units.filter((u) => Object.entries(at).every(([k, v]) => u.conditions[k] === v))
      : units;
  const m = medianNetwork(chosen.map((u) => u.network));
  if (!('value' in m)) return { json, csv, median: null, noMedian: m.why };
  const name = `${partFileStem(part.part, slug)}-median.s${m.value.ports}p`;
  return {
    json,
    csv,
    median: {
      url: `parts/${slug}/${name}`,
      text: medianTouchstone(
        part.part,
        part.revision,
        chosen.map((u) => u.unit),
        m.value,
      ),
    },
    noMedian: '',
  };
}

/** What a page rests on: its spec file (a part or comparison file) and the measured files of its units, relative to the content folder, with their SHA-256 and the fingerprint of them all. */

/** The band of the class's main transmission limit (a filter's insertion-loss passband, an amplifier's gain band), else of the first limit. */
function defaultOperatingBand(part: NormalizedPart): { fromHz: number; toHz: number } | null {
  const main = classOf(part.partClass).transmission;
  const limits = part.checks.filter((c) => c.kind === 'limit' && !c.change);
  return (limits.find((c) => main.includes(c.figure.id)) ?? limits[0])?.band ?? null;
}
