/**
 * The datasheet's specification table: the class's headline figures as rows
 * of Min / Typ / Max with their conditions, grouped by band, then the
 * specifications the vendor declares; the footnote marks of how each limit is
 * assured; and the disclaimer those marks imply. Values only: no files.
 */
import type { CheckResult } from '../evaluate/evaluate.js';
import { classOf } from '../classes/registry.js';
import { bandRange } from '../format/units.js';
import { displayUnit, formatLimit, formatNumber, formatValue, type Cell } from '../format/values.js';
import type { NormalizedPart } from '../part-file/normalize.js';
import type { Assurance } from '../part-file/part-schema.js';
import type { SpecGroup, SpecRow } from '../model/catalog.js';

/** Footnote marks of how a limit is assured. */
export const ASSURANCE_MARKS: Readonly<Record<Assurance, string>> = { 'every-unit': '†', sample: '‡', design: '§' };
const ASSURANCE_TEXT: Readonly<Record<Assurance, string>> = {
  'every-unit': 'tested on every unit shipped',
  sample: 'established by characterisation of a sample and not tested on every unit',
  design: 'assured by design and not tested',
};

export const conditionText = (c: Readonly<Record<string, string>>) =>
  Object.entries(c)
    .map(([k, v]) => `${k} ${v}`)
    .join(', ');

function specRow(
  r: CheckResult,
  when: Readonly<Record<string, string>> | null,
  typicalAt: Readonly<Record<string, string>> | null,
  reference: string,
  resolutionHz: number | null,
): Omit<SpecRow, 'result'> {
  const l = r.limit;
  const two = l?.tolerance !== undefined && l.nominal !== undefined;
  const min = two ? (l.nominal as number) - (l.tolerance as number) : (l?.min ?? null);
  const max = two ? (l.nominal as number) + (l.tolerance as number) : (l?.max ?? null);
  const d = displayUnit([min, max, r.typical], r.unit);
  const num = (v: number | null): Cell => ({ text: formatNumber(v, r.unit, d, resolutionHz), value: v !== null && Number.isFinite(v) ? v : null });
  // a two-sided typical is shown as its deviation from nominal, so that units on either side do not read as cancelling
  const typ: Cell = two
    ? { text: `${formatNumber(l.nominal as number, r.unit, d)} ± ${formatNumber(Math.abs(r.typical - (l.nominal as number)), r.unit, d)}`, value: r.typical }
    : num(r.typical);
  // the part's typical-at is stated once above the table; a row says more only where its typical differs from that
  const typicalNote = r.typicalAt
    ? ''
    : typicalAt
      ? `typical over its own units (none measured at ${conditionText(typicalAt)})`
      : r.typicalMixed
        ? 'typical over units measured under different conditions'
        : '';
  // the band heads the group; the row states the conditions its limit holds under, and the reference impedance
  const conditions = [when ? conditionText(when) : 'all measured conditions', reference].filter(Boolean).join(', ');
  const limitText =
    max !== null && min !== null && !two
      ? `${formatLimit(r.limit, r.unit)}`
      : max !== null
        ? `≤ ${formatValue(max, r.unit)} max`
        : min !== null
          ? `≥ ${formatValue(min, r.unit)} min`
          : '';
  return {
    label: r.label,
    on: r.on.join(', '),
    conditions,
    declared: false,
    min: num(min),
    typ,
    max: num(max),
    unit: d.label,
    mark: r.assuredBy ? ASSURANCE_MARKS[r.assuredBy] : '',
    typicalNote,
    summary: `${r.label} ${two ? typ.text + ' ' + d.label : formatValue(r.typical, r.unit, resolutionHz)} typ${limitText && !two ? `, ${limitText}` : ''}`,
  };
}

/**
 * The specification table: the class's headline figures in its order (or the
 * first limits), grouped by band in the order the bands first appear, then
 * the vendor's declared specifications.
 */
export function specification(part: NormalizedPart, results: readonly CheckResult[], reference: string, resolutionHz: number | null = null): SpecGroup[] {
  const order = classOf(part.partClass).headline;
  const picked: CheckResult[] = [];
  for (const id of order) for (const r of results) if (r.figure === id && !r.change && !picked.includes(r)) picked.push(r);
  const rows = picked.length ? picked : results.filter((r) => r.limit && !r.change).slice(0, 5);
  const groups = new Map<string, SpecRow[]>();
  for (const r of rows) {
    const title = `${r.band} (${bandRange(r.fromHz, r.toHz)})`;
    const list = groups.get(title) ?? [];
    list.push({ ...specRow(r, part.checks[results.indexOf(r)]?.when ?? null, part.typicalAt, reference, resolutionHz), result: results.indexOf(r) });
    groups.set(title, list);
  }
  const out: SpecGroup[] = [...groups].map(([title, list]) => ({ title, rows: list }));
  if (part.declared.length) {
    out.push({
      title: 'declared by the vendor (not computed from the measured files)',
      rows: part.declared.map((d) => ({
        label: d.parameter,
        on: '',
        conditions: d.conditions ?? '',
        declared: true,
        result: null,
        min: { text: d.min ?? '', value: null },
        typ: { text: d.typ ?? '', value: null },
        max: { text: d.max ?? '', value: null },
        unit: d.unit,
        mark: DECLARED_MARK,
        typicalNote: '',
        summary: `${d.parameter} ${d.typ ?? d.max ?? d.min ?? ''} ${d.unit}`.trim(),
      })),
    });
  }
  return out;
}

/** The mark of a declared specification. */
export const DECLARED_MARK = '*';

/** The disclaimer a datasheet closes with: what its figures are, and what each mark in its table means. */
export function composeDisclaimer(results: readonly CheckResult[], declared = false): string {
  const used = ASSURANCES_IN_ORDER.filter((a) => results.some((r) => r.assuredBy === a));
  const marks = used.map((a) => `limits marked ${ASSURANCE_MARKS[a]} are ${ASSURANCE_TEXT[a]}`);
  const unmarked = results.some((r) => r.limit && !r.assuredBy);
  return [
    'Figures are computed from the measured units listed on this datasheet and describe those units.',
    marks.length ? `${marks.join('; ').replace(/^l/, 'L')}.` : '',
    unmarked ? `${marks.length ? 'Other limits are' : 'The limits are'} checked on those units only and are not a guarantee for other units.` : '',
    declared ? `Values marked ${DECLARED_MARK} are declared by the vendor and were not computed from the measured files.` : '',
    "Whether the part suits an application is for the user's own qualification to establish.",
  ]
    .filter(Boolean)
    .join(' ');
}

const ASSURANCES_IN_ORDER: readonly Assurance[] = ['every-unit', 'sample', 'design'];
