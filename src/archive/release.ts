/**
 * Released revisions. `scatterbook release` freezes a part's current
 * revision: its documents go under content/parts/<slug>/released/<revision>/
 * and a release record, release-<revision>.txt, is written beside the part
 * file (plain text, one fact per line, meant to be committed). Records are
 * the commit point: a released/<revision>/ folder without its record was
 * never released. A later build whose part file or data differ from the
 * record of the part's current revision fails until the revision is raised.
 * This module is pure: text in, values out.
 */
import type { CheckResult } from '../evaluate/evaluate.js';
import { formatStages, formatValue } from '../format/values.js';

export interface RecordedFile {
  readonly path: string;
  readonly sha256: string;
}

export interface RecordedFigure {
  /** figure, parameters and band (and a change's stages): what identifies a row across revisions. */
  readonly key: string;
  readonly worst: number;
  readonly unit: string;
  readonly margin: number | null;
  readonly pass: boolean | null;
}

export interface ReleaseRecord {
  readonly part: string;
  readonly revision: string;
  readonly date: string;
  /** When it was released (ISO 8601, UTC). */
  readonly released: string;
  readonly tool: string;
  readonly fingerprint: string;
  readonly spec: RecordedFile;
  readonly data: readonly RecordedFile[];
  readonly documents: readonly RecordedFile[];
  readonly figures: readonly RecordedFigure[];
}

/** release-<revision>.txt, the revision kept to letters, digits, '.', '-' and '_'. */
const fileSafe = (revision: string) => revision.replace(/[^A-Za-z0-9._-]+/g, '_');
export const recordName = (revision: string) => `release-${fileSafe(revision)}.txt`;
export const releasedFolder = (revision: string) => `released/${fileSafe(revision)}`;

export function figureKey(r: Pick<CheckResult, 'figure' | 'on' | 'band' | 'change'>): string {
  return `${r.figure} ${r.on.join('+')} over ${r.band}${r.change ? ` (change ${formatStages(r.change)})` : ''}`;
}

const HEADER = '# scatterbook release record: commit it with the part; later builds check the part file and data against it';

export function recordText(r: ReleaseRecord): string {
  const num = (v: number | null) => (v === null ? 'none' : String(v));
  return [
    HEADER,
    `part: ${r.part}`,
    `revision: ${r.revision}`,
    `date: ${r.date}`,
    `released: ${r.released}`,
    `tool: ${r.tool}`,
    `fingerprint: ${r.fingerprint}`,
    `spec: ${r.spec.sha256} ${r.spec.path}`,
    ...r.data.map((d) => `data: ${d.sha256} ${d.path}`),
    ...r.documents.map((d) => `document: ${d.sha256} ${d.path}`),
    ...r.figures.map(
      (f) => `figure: ${f.key} | worst ${num(f.worst)} ${f.unit || '-'} | margin ${num(f.margin)} | ${f.pass === null ? 'report' : f.pass ? 'pass' : 'fail'}`,
    ),
    '',
  ].join('\n');
}

/** A record's text → the record, or the line that is not one. */
export function parseRecord(text: string): { value: ReleaseRecord } | { line: number; message: string } {
  const fields = new Map<string, string>();
  const data: RecordedFile[] = [],
    documents: RecordedFile[] = [],
    figures: RecordedFigure[] = [];
  let spec: RecordedFile | null = null;
  const lines = text.split(/\r?\n/);
  for (const [i, raw] of lines.entries()) {
    const line = raw.trim();
    if (!line || line.startsWith('#')) continue;
    const m = /^([a-z]+):\s?(.*)$/.exec(line);
    if (!m) return { line: i + 1, message: 'expected "key: value"' };
    const [, key, value] = m;
    if (key === 'spec' || key === 'data' || key === 'document') {
      const f = /^([0-9a-f]{64}) (.+)$/.exec(value);
      if (!f) return { line: i + 1, message: `expected "${key}: SHA256 PATH"` };
      const file = { sha256: f[1], path: f[2] };
      if (key === 'spec') spec = file;
      else (key === 'data' ? data : documents).push(file);
    } else if (key === 'figure') {
      const f = /^(.+) \| worst (\S+) (\S+) \| margin (\S+) \| (pass|fail|report)$/.exec(value);
      if (!f) return { line: i + 1, message: 'expected "figure: KEY | worst V UNIT | margin V | pass|fail|report"' };
      const n = (s: string) => (s === 'none' ? null : Number(s));
      figures.push({ key: f[1], worst: n(f[2]) as number, unit: f[3] === '-' ? '' : f[3], margin: n(f[4]), pass: f[5] === 'report' ? null : f[5] === 'pass' });
    } else fields.set(key, value);
  }
  for (const k of ['part', 'revision', 'released']) if (!fields.has(k)) return { line: 0, message: `no "${k}:" line` };
  if (!spec) return { line: 0, message: 'no "spec:" line' };
  return {
    value: {
      part: fields.get('part') as string,
      revision: fields.get('revision') as string,
      date: fields.get('date') ?? '',
      released: fields.get('released') as string,
      tool: fields.get('tool') ?? '',
      fingerprint: fields.get('fingerprint') ?? '',
      spec,
      data,
      documents,
      figures,
    },
  };
}

export function recordedFigures(results: readonly CheckResult[]): RecordedFigure[] {
  return results.map((r) => ({ key: figureKey(r), worst: r.worst, unit: r.unit, margin: r.margin, pass: r.pass }));
}

/** What differs between a record and the part's files now, in words; empty when they agree. */
export function changedSince(record: ReleaseRecord, spec: RecordedFile, data: readonly RecordedFile[]): string[] {
  const out: string[] = [];
  const short = (h: string) => h.slice(0, 12);
  if (record.spec.sha256 !== spec.sha256) out.push(`${spec.path} (SHA-256 ${short(record.spec.sha256)}… then, ${short(spec.sha256)}… now)`);
  const then = new Map(record.data.map((d) => [d.path, d.sha256]));
  const now = new Map(data.map((d) => [d.path, d.sha256]));
  for (const [path, h] of now) {
    const was = then.get(path);
    if (was === undefined) out.push(`${path} (added since)`);
    else if (was !== h) out.push(`${path} (SHA-256 ${short(was)}… then, ${short(h)}… now)`);
  }
  for (const path of then.keys()) if (!now.has(path)) out.push(`${path} (removed since)`);
  return out;
}

/** The changes of the figures from one revision to the next, in words ("insertion-loss S21 over passband: worst 1.92 dB → 1.84 dB"). */
export function figureChanges(before: readonly RecordedFigure[], after: readonly RecordedFigure[]): string[] {
  const old = new Map(before.map((f) => [f.key, f]));
  const out: string[] = [];
  for (const f of after) {
    const o = old.get(f.key);
    if (!o) out.push(`${f.key}: new (worst ${formatValue(f.worst, f.unit)})`);
    else {
      const parts: string[] = [];
      if (formatValue(o.worst, o.unit) !== formatValue(f.worst, f.unit)) parts.push(`worst ${formatValue(o.worst, o.unit)} → ${formatValue(f.worst, f.unit)}`);
      if (formatValue(o.margin, o.unit) !== formatValue(f.margin, f.unit))
        parts.push(`margin ${formatValue(o.margin, o.unit)} → ${formatValue(f.margin, f.unit)}${parts.length ? '' : ' (the limit changed)'}`);
      if (o.pass !== f.pass) parts.push(`${o.pass ? 'pass' : 'fail'} → ${f.pass ? 'pass' : 'fail'}`);
      if (parts.length) out.push(`${f.key}: ${parts.join(', ')}`);
    }
    old.delete(f.key);
  }
  for (const k of old.keys()) out.push(`${k}: no longer listed`);
  return out;
}
