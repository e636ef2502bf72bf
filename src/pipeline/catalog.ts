/**
 * A content folder → one serializable catalog model: every part's figures,
 * plots (as SVG), measurement provenance and data quality, formatted for the
 * templates, which only place it. Eleventy receives this as global data.
 */
import { existsSync, readdirSync, realpathSync, statSync } from 'node:fs';
import { join, relative } from 'node:path';
import type { CheckResult } from '../evaluate/evaluate.js';
import { figuresJson } from '../evaluate/json.js';
import { largest, smallest } from '../evaluate/stats.js';
import { formatFrequency, trimNumber } from '../format/units.js';
import { displayUnit, formatLimit, formatNumber, formatValue } from '../format/values.js';
import { ieee370Quality } from '../network/ieee370.js';
import { passivity, reciprocity } from '../network/quality.js';
import { classOf } from '../classes/registry.js';
import { buildPlots } from '../plots/model.js';
import { renderPlotAnywhere } from '../plots/pool.js';
import { formatSpecError, type SpecError } from '../spec/diagnostics.js';
import type { NormalizedPart } from '../spec/normalize.js';
import type { Assurance } from '../spec/part-schema.js';
import { cautionsFor } from '../site/cautions.js';
import { renderMarkdown } from '../site/markdown.js';
import { assetPathProblem, loadSettings, type SiteSettings } from '../site/settings.js';
import { realPath, within } from '../io/output-folder.js';
import { readYamlFile } from '../io/text-file.js';
import { evaluatePartFile, type LoadedUnit, type StageTimes } from './part.js';

export interface Cell {
  readonly text: string;
  /** The exact number behind the text (null where there is none). */
  readonly value: number | null;
}

export interface ComplianceRow {
  readonly label: string;
  readonly figure: string;
  readonly on: string;
  readonly band: string;
  readonly bandRange: string;
  readonly limit: string;
  readonly typical: Cell;
  readonly worst: Cell;
  readonly worstUnit: string;
  readonly at: Cell;
  readonly margin: Cell;
  readonly verdict: 'PASS' | 'FAIL' | 'REPORT';
  readonly units: ReadonlyArray<{ readonly unit: string; readonly worst: Cell; readonly at: Cell; readonly margin: Cell; readonly verdict: 'PASS' | 'FAIL' | 'REPORT' }>;
}

/** A row of the specification table: a figure over a band, with its limits and its typical value. */
export interface SpecRow {
  readonly label: string;
  readonly on: string;
  /** Band and conditions, e.g. "2.40 GHz to 2.50 GHz" or "10 MHz to 6 GHz, temperature 85 °C". */
  readonly conditions: string;
  readonly min: Cell;
  readonly typ: Cell;
  readonly max: Cell;
  readonly unit: string;
  /** The footnote mark of how the limit is assured ('' when it is checked on the listed units only). */
  readonly mark: string;
  /** Where typical comes from when that needs saying: "at temperature 25 °C", "over mixed conditions". */
  readonly typicalNote: string;
  /** One line for the catalog index: "Insertion loss 0.92 dB typ, ≤ 1.20 dB max". */
  readonly summary: string;
}

export interface PlotBlock {
  readonly id: string;
  readonly title: string;
  readonly svg: string;
  readonly legend: ReadonlyArray<{ readonly label: string; readonly color: string; readonly dash: string }>;
  /** Limits of one series, drawn as a thick line in its style. */
  readonly limitLegend: ReadonlyArray<{ readonly label: string; readonly color: string; readonly dash: string }>;
  /** Distinct units, and measurements (a unit at three temperatures counts three times). */
  readonly unitCount: number;
  readonly measurementCount: number;
  readonly hasLimits: boolean;
}

export interface MeasurementRow {
  readonly unit: string;
  readonly conditions: string;
  readonly file: string;
  readonly sha256: string;
  readonly points: number;
  readonly range: string;
  readonly reference: string;
  readonly touchstone: string;
  readonly notes: string;
}

export interface QualityRow {
  readonly unit: string;
  readonly passivity: string;
  readonly reciprocity: string;
  readonly ieee370: string;
  /** A warning for the reader, or null when the data look as the class expects. */
  readonly flag: string | null;
}

export interface PartPage {
  readonly slug: string;
  readonly url: string;
  readonly pdfUrl: string | null;
  readonly part: string;
  readonly title: string;
  readonly partClass: string;
  readonly revision: string;
  readonly date: string;
  readonly vendor: string;
  readonly description: string;
  readonly notesHtml: string;
  readonly packageText: string;
  readonly connector: string;
  readonly operatingTemperature: string;
  readonly ports: ReadonlyArray<{ readonly number: number; readonly name: string }>;
  readonly pass: boolean;
  readonly frequencyRange: string;
  readonly specification: readonly SpecRow[];
  /** The conditions typical values are quoted at (typical-at), as text, or ''. */
  readonly typicalConditions: string;
  /** The closing disclaimer: the vendor's, or one composed from how the limits are assured. */
  readonly disclaimer: string;
  readonly compliance: readonly ComplianceRow[];
  readonly plots: readonly PlotBlock[];
  readonly measurements: readonly MeasurementRow[];
  readonly quality: readonly QualityRow[];
  readonly ratings: ReadonlyArray<{ readonly parameter: string; readonly value: string; readonly notes: string }>;
  readonly cautions: readonly string[];
  /** Warnings of the evaluation, formatted (FILE:LINE:COL: warning: …), for the page and the terminal. */
  readonly warnings: readonly string[];
  /** The JSON of `scatterbook figures --json`, for machine readers and tests. */
  readonly figuresJson: string;
}

export interface PartFailure {
  readonly slug: string;
  readonly file: string;
  readonly messages: readonly string[];
}

export interface Catalog {
  readonly site: SiteSettings;
  readonly parts: readonly PartPage[];
  readonly byClass: ReadonlyArray<{ readonly partClass: string; readonly parts: readonly PartPage[] }>;
  readonly failures: readonly PartFailure[];
  readonly generator: string;
}


const cell = (v: number | null, unit: string): Cell => ({ text: formatValue(v, unit), value: v !== null && Number.isFinite(v) ? v : null });
const atCell = (hz: number | null): Cell => ({ text: hz === null ? '—' : formatFrequency(hz), value: hz });
const verdictOf = (pass: boolean | null): 'PASS' | 'FAIL' | 'REPORT' => (pass === null ? 'REPORT' : pass ? 'PASS' : 'FAIL');

export function bandRange(fromHz: number, toHz: number): string {
  return fromHz === toHz ? formatFrequency(fromHz) : `${formatFrequency(fromHz)} to ${formatFrequency(toHz)}`;
}

function complianceRow(r: CheckResult): ComplianceRow {
  return {
    label: r.label,
    figure: r.figure,
    on: r.on.join(', '),
    band: r.band,
    bandRange: bandRange(r.fromHz, r.toHz),
    limit: formatLimit(r.limit, r.unit),
    typical: cell(r.typical, r.unit),
    worst: cell(r.worst, r.unit),
    worstUnit: r.worstUnit,
    at: atCell(r.worstAtHz),
    margin: cell(r.margin, r.unit),
    verdict: verdictOf(r.pass),
    units: r.units.map((u) => ({ unit: u.unit, worst: cell(u.worst, r.unit), at: atCell(u.atHz), margin: cell(u.margin, r.unit), verdict: verdictOf(u.pass) })),
  };
}

/** Footnote marks of how a limit is assured. */
export const ASSURANCE_MARKS: Readonly<Record<Assurance, string>> = { 'every-unit': '†', sample: '‡', design: '§' };
const ASSURANCE_TEXT: Readonly<Record<Assurance, string>> = {
  'every-unit': 'tested on every unit shipped',
  sample: 'established by characterisation of a sample and not tested on every unit',
  design: 'assured by design and not tested',
};

const conditionText = (c: Readonly<Record<string, string>>) => Object.entries(c).map(([k, v]) => `${k} ${v}`).join(', ');

function specRow(r: CheckResult, when: Readonly<Record<string, string>> | null, typicalAt: Readonly<Record<string, string>> | null): SpecRow {
  const l = r.limit;
  const two = l?.tolerance !== undefined && l.nominal !== undefined;
  const min = two ? (l.nominal as number) - (l.tolerance as number) : (l?.min ?? null);
  const max = two ? (l.nominal as number) + (l.tolerance as number) : (l?.max ?? null);
  const d = displayUnit([min, max, r.typical], r.unit);
  const num = (v: number | null): Cell => ({ text: formatNumber(v, r.unit, d), value: v !== null && Number.isFinite(v) ? v : null });
  // a two-sided typical is shown as its deviation from nominal, so that units on either side do not read as cancelling
  const typ: Cell = two ? { text: `${formatNumber(l.nominal as number, r.unit, d)} ± ${formatNumber(Math.abs(r.typical - (l.nominal as number)), r.unit, d)}`, value: r.typical } : num(r.typical);
  // the part's typical-at is stated once above the table; a row says more only where its typical differs from that
  const typicalNote = r.typicalAt ? '' : typicalAt ? `typical over its own units (none measured at ${conditionText(typicalAt)})` : r.typicalMixed ? 'typical over units measured under different conditions' : '';
  const conditions = [bandRange(r.fromHz, r.toHz), when ? conditionText(when) : ''].filter(Boolean).join(', ');
  const limitText = max !== null && min !== null && !two ? `${formatLimit(r.limit, r.unit)}` : max !== null ? `≤ ${formatValue(max, r.unit)} max` : min !== null ? `≥ ${formatValue(min, r.unit)} min` : '';
  return {
    label: r.label,
    on: r.on.join(', '),
    conditions,
    min: num(min),
    typ,
    max: num(max),
    unit: d.label,
    mark: r.assuredBy ? ASSURANCE_MARKS[r.assuredBy] : '',
    typicalNote,
    summary: `${r.label} ${two ? typ.text + ' ' + d.label : formatValue(r.typical, r.unit)} typ${limitText && !two ? `, ${limitText}` : ''}`,
  };
}

/** The rows of the specification table: the class's headline figures in its order (or the first limits), then nothing else. */
function specification(part: NormalizedPart, results: readonly CheckResult[]): SpecRow[] {
  const order = classOf(part.partClass).headline;
  const picked: CheckResult[] = [];
  for (const id of order) for (const r of results) if (r.figure === id && !picked.includes(r)) picked.push(r);
  const rows = picked.length ? picked : results.filter((r) => r.limit).slice(0, 5);
  return rows.map((r) => specRow(r, part.checks[results.indexOf(r)]?.when ?? null, part.typicalAt));
}

/** The disclaimer a datasheet closes with: what its figures are, and what each mark in its table means. */
export function composeDisclaimer(results: readonly CheckResult[]): string {
  const used = ASSURANCES_IN_ORDER.filter((a) => results.some((r) => r.assuredBy === a));
  const marks = used.map((a) => `limits marked ${ASSURANCE_MARKS[a]} are ${ASSURANCE_TEXT[a]}`);
  const unmarked = results.some((r) => r.limit && !r.assuredBy);
  return [
    'Figures are computed from the measured units listed on this datasheet and describe those units.',
    marks.length ? `${marks.join('; ').replace(/^l/, 'L')}.` : '',
    unmarked ? `${marks.length ? 'Other limits are' : 'The limits are'} checked on those units only and are not a guarantee for other units.` : '',
    'The application\'s own qualification and local codes and regulations govern use.',
  ]
    .filter(Boolean)
    .join(' ');
}

const ASSURANCES_IN_ORDER: readonly Assurance[] = ['every-unit', 'sample', 'design'];

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
  return { unit: u.unit, passivity: passText, reciprocity: recText, ieee370: `passivity ${metric(q.passivity)}, reciprocity ${metric(q.reciprocity)}, causality ${metric(q.causality)}`, flag };
}

function measurement(u: LoadedUnit, m: NormalizedPart['measurements'][number] | undefined): MeasurementRow {
  const net = u.network;
  const k = net.freqHz.length;
  const uniform = net.z0.every((r) => r === net.z0[0]);
  return {
    unit: u.unit,
    conditions: Object.entries(u.conditions).map(([key, v]) => `${key}: ${v}`).join(', ') || '—',
    file: u.file,
    sha256: u.sha256,
    points: k,
    range: bandRange(net.freqHz[0], net.freqHz[k - 1]),
    reference: uniform ? `${trimNumber(net.z0[0])} Ω` : Array.from(net.z0, (r, i) => `${i + 1}: ${trimNumber(r)} Ω`).join(', '),
    touchstone: `${u.data.info.version}, ${u.data.info.parameter} ${u.data.info.format}`,
    notes: m?.notes ?? '',
  };
}

export interface PartBuild {
  readonly page: PartPage | null;
  readonly failure: PartFailure | null;
}

/** Builds one part's page model; errors come back as a failure, never thrown. */
export async function buildPartPage(partFile: string, contentRoot: string, slug: string, settings: SiteSettings, times?: StageTimes): Promise<PartBuild> {
  const display = relative(process.cwd(), partFile) || partFile;
  const outcome = await evaluatePartFile(partFile, contentRoot, display, times);
  if (!outcome.result || !outcome.part) {
    return { page: null, failure: { slug, file: display, messages: outcome.errors.map((e: SpecError) => formatSpecError(e, e.file === display ? outcome.source : undefined)) } };
  }
  const part = outcome.part;
  const result = outcome.result;
  const tp = performance.now();
  const models = buildPlots(part, outcome.units);
  const svgs = await Promise.all(models.map((m) => renderPlotAnywhere(m, `${slug}-`)));
  const plots: PlotBlock[] = models.map((m, i) => ({
    id: m.id,
    title: m.title,
    svg: svgs[i],
    legend: m.items.map((label, j) => ({ label, color: m.colors[j], dash: m.dashes[j].join(' ') })),
    limitLegend: m.seriesLimits.map((l) => ({ label: l.label, color: l.color, dash: l.dash.join(' ') })),
    unitCount: m.unitCount,
    measurementCount: m.measurementCount,
    hasLimits: m.regions.length > 0,
  }));
  if (times) times.plots += performance.now() - tp;
  const lo = largest(outcome.units.map((u) => u.network.freqHz[0]));
  const hi = smallest(outcome.units.map((u) => u.network.freqHz[u.network.freqHz.length - 1]));
  const page: PartPage = {
    slug,
    url: `parts/${slug}/`,
    pdfUrl: null,
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
    specification: specification(part, result.results),
    typicalConditions: part.typicalAt ? conditionText(part.typicalAt) : '',
    disclaimer: settings.disclaimer ?? composeDisclaimer(result.results),
    compliance: result.results.map(complianceRow),
    plots,
    measurements: outcome.units.map((u, i) => measurement(u, part.measurements[i])),
    quality: outcome.units.map((u) => quality(part, u)),
    ratings: part.ratings.map((r) => ({ parameter: r.parameter, value: r.value, notes: r.notes ?? '' })),
    cautions: cautionsFor(part.partClass, part.cautions),
    warnings: result.warnings.map((w) => formatSpecError(w, undefined, 'warning')),
    // safe inside <script type="application/json">: no "<" can close the element
    figuresJson: JSON.stringify(figuresJson(result)).replace(/</g, '\\u003c'),
  };
  return { page, failure: null };
}

/** The part folders of a content folder: parts/<slug>/part.yaml, in name order. */
export function partFolders(contentRoot: string): Array<{ slug: string; file: string }> {
  const dir = join(contentRoot, 'parts');
  if (!existsSync(dir)) return [];
  return readdirSync(dir)
    .filter((name) => {
      if (name.startsWith('.')) return false;
      try {
        return statSync(join(dir, name)).isDirectory() && existsSync(join(dir, name, 'part.yaml'));
      } catch {
        return false; // a broken link
      }
    })
    .sort()
    .map((slug) => ({ slug, file: join(dir, slug, 'part.yaml') }));
}

/** content/site.yaml, parsed and checked (logo and stylesheet must be files of the content folder's assets/); `text` is '' when there is none (it also keys the cache). */
export function readSettings(contentRoot: string): { settings: SiteSettings; errors: string[]; text: string } {
  const file = join(contentRoot, 'site.yaml');
  const shown = relative(process.cwd(), file) || file;
  const read = readYamlFile(file, shown, 'site.yaml');
  if (!read.ok && !read.missing) return { settings: loadSettings(null, shown).value, errors: [formatSpecError(read.error)], text: '' };
  const text = read.ok ? read.text : null;
  const r = loadSettings(text, shown);
  const errors = [...r.errors];
  const content = realPath(contentRoot);
  const isFile = (rel: string): boolean | 'outside' => {
    try {
      if (!within(content, realpathSync(join(contentRoot, rel)))) return 'outside';
      return statSync(join(contentRoot, rel)).isFile();
    } catch {
      return false;
    }
  };
  for (const key of ['logo', 'stylesheet'] as const) {
    const value = r.value[key];
    const problem = value === null ? null : assetPathProblem(key, value, isFile);
    if (problem) errors.push({ code: 'bad-value', file: shown, message: problem, ...(r.positions.get(key) ?? { line: 0, column: 0 }) });
  }
  return { settings: r.value, errors: errors.map((e) => formatSpecError(e, text ?? undefined)), text: text ?? '' };
}

export function assembleCatalog(site: SiteSettings, parts: readonly PartPage[], failures: readonly PartFailure[], version: string): Catalog {
  const classes = [...new Set(parts.map((p) => p.partClass))];
  return {
    site,
    parts,
    byClass: classes.map((c) => ({ partClass: c, parts: parts.filter((p) => p.partClass === c) })),
    failures,
    generator: `scatterbook ${version}`,
  };
}
