/**
 * Comparison file text → NormalizedComparison, in the part file's stages:
 * YAML 1.2 → schema check (COMPARISON_SCHEMA) → normalization. The bands and
 * limits are normalized by the part file's own code (normalizePart), so a
 * requirement means exactly what the same lines mean in a part file. All
 * errors come back at once, each at its line and column. Paths are checked
 * for form here; whether they exist and stay inside the content folder is the
 * shell's business (pipeline/comparison.ts).
 */
import type { Position, SpecError } from './diagnostics.js';
import { COMPARISON_SCHEMA } from './comparison-schema.js';
import { parseYaml } from './load.js';
import { normalizePart, type NormalizedPart } from './normalize.js';
import { validate, type Plain } from './validate.js';

export type CandidateSource =
  | { readonly kind: 'part'; readonly path: string; readonly at: Position }
  | { readonly kind: 'files'; readonly paths: readonly string[]; readonly at: readonly Position[] };

export interface CandidateSpec {
  readonly label: string;
  readonly vendor: string | null;
  readonly notes: string | null;
  readonly source: CandidateSource;
  /** Our port i (1-based) is the file's port portMap[i − 1]; null: the file's own numbering. */
  readonly portMap: readonly number[] | null;
  readonly portsAt: Position;
  readonly at: Position;
}

export interface NormalizedComparison {
  readonly file: string;
  readonly title: string;
  readonly description: string | null;
  readonly date: string | null;
  /** Every candidate is renormalized to this, ohms. */
  readonly referenceOhms: number;
  /** The bands and limits, as a part without units: what the figure engine evaluates every candidate against. */
  readonly requirement: NormalizedPart;
  readonly candidates: readonly CandidateSpec[];
  /** The label of the candidate the others are compared against, or null. */
  readonly baseline: string | null;
}

/** "50 ohm", "50 ohms", "50 Ω", "50Ω", 50 → 50; null when it is none of these or not a positive, finite number. */
export function parseOhms(v: Plain | undefined): number | null {
  if (typeof v === 'number') return Number.isFinite(v) && v > 0 ? v : null;
  if (typeof v !== 'string') return null;
  const m = /^\s*(\d+(?:\.\d*)?|\.\d+)(?:[eE][+-]?\d+)?\s*(?:ohms?|Ω)?\s*$/i.exec(v);
  if (!m) return null;
  const n = Number(v.replace(/\s*(ohms?|Ω)\s*$/i, ''));
  return Number.isFinite(n) && n > 0 ? n : null;
}

type Obj = Record<string, Plain>;
const isObj = (v: Plain | undefined): v is Obj => typeof v === 'object' && v !== null && !Array.isArray(v);
const text = (v: Plain | undefined): string | null => (typeof v === 'string' ? v : null);

export function loadComparisonText(text_: string, file: string): { value: NormalizedComparison | null; errors: readonly SpecError[] } {
  const { doc, lines, errors: syntax } = parseYaml(text_, file);
  if (syntax.length) return { value: null, errors: syntax };
  if (doc.contents === null)
    return {
      value: null,
      errors: [{ code: 'missing-key', file, message: 'the comparison file is empty; it needs title, bands, limits and candidates', line: 0, column: 0 }],
    };
  const checked = validate(doc.contents, COMPARISON_SCHEMA, file, lines, (a) => a.resolve(doc), 'the comparison file');
  const spec = isObj(checked.value) ? checked.value : {};
  const errors: SpecError[] = [...checked.errors];
  const at = (path: string): Position => checked.positions.get(path) ?? { line: 0, column: 0 };
  const err = (code: SpecError['code'], path: string, message: string) => errors.push({ code, file, message, ...at(path) });

  // the requirement: a part of no units, read by the part file's own rules (same paths, so the same positions)
  const asPart: Obj = { part: text(spec.title) ?? '', class: spec.class ?? 'generic', measurements: [] };
  for (const k of ['bands', 'limits', 'ways', 'phase-split', 'mixed-mode'] as const) if (spec[k] !== undefined) asPart[k] = spec[k];
  const requirement = normalizePart({ file, value: asPart, positions: checked.positions });
  errors.push(...requirement.errors);

  let referenceOhms = 50;
  if (spec.reference !== undefined) {
    const r = parseOhms(spec.reference);
    if (r === null)
      err('bad-value', 'reference', `reference "${spec.reference}" is not an impedance; expected a positive number of ohms, e.g. 50 ohm, 75 Ω or 50`);
    else referenceOhms = r;
  }

  const candidates: CandidateSpec[] = [];
  const labels = new Map<string, number>();
  if (Array.isArray(spec.candidates)) {
    spec.candidates.forEach((c, i) => {
      const path = `candidates.${i}`;
      if (!isObj(c) || typeof c.label !== 'string') return;
      const label = c.label.trim();
      if (!label) err('bad-value', `${path}.label`, "a candidate's label must not be empty");
      if (labels.has(label))
        err(
          'duplicate',
          `${path}.label`,
          `the label "${label}" is used twice (candidates ${(labels.get(label) as number) + 1} and ${i + 1}); each candidate needs its own`,
        );
      labels.set(label, i);
      const given = (['part', 'files', 'file'] as const).filter((k) => c[k] !== undefined || checked.positions.has(`${path}#${k}`));
      if (given.length !== 1) {
        err(
          'bad-value',
          given.length ? `${path}#${given[1]}` : path,
          given.length
            ? `candidate "${label}" gives ${given.join(' and ')}; give one of part (a catalog part file), files (its units' Touchstone files) or file (one)`
            : `candidate "${label}" has no data: give part (a catalog part file), files (its units' Touchstone files) or file (one)`,
        );
        return;
      }
      let source: CandidateSource;
      if (typeof c.part === 'string') source = { kind: 'part', path: c.part, at: at(`${path}.part`) };
      else if (typeof c.file === 'string') source = { kind: 'files', paths: [c.file], at: [at(`${path}.file`)] };
      else if (Array.isArray(c.files) && c.files.every((f) => typeof f === 'string'))
        source = { kind: 'files', paths: c.files as string[], at: c.files.map((_, j) => at(`${path}.files.${j}`)) };
      else return; // the schema check said what is wrong
      let portMap: number[] | null = null;
      if (isObj(c.ports)) {
        const entries = Object.entries(c.ports)
          .map(([k, v]) => [Number(k), v] as const)
          .sort((a, b) => a[0] - b[0]);
        const ours = entries.map(([k]) => k);
        const missing = ours.length ? Array.from({ length: ours[ours.length - 1] }, (_, k) => k + 1).filter((k) => !ours.includes(k)) : [];
        const theirs = new Map<number, number>();
        let ok = entries.length > 0;
        if (!entries.length) {
          err('bad-value', `${path}.ports`, `the port map of "${label}" is empty; leave ports out for the file's own numbering`);
        }
        if (missing.length) {
          ok = false;
          err(
            'bad-value',
            `${path}.ports`,
            `the port map of "${label}" skips our port${missing.length > 1 ? 's' : ''} ${missing.join(', ')}; our ports are numbered 1 to ${ours[ours.length - 1]} without gaps`,
          );
        }
        for (const [k, v] of entries) {
          if (typeof v !== 'number') {
            ok = false;
            continue;
          }
          if (theirs.has(v)) {
            ok = false;
            err(
              'bad-value',
              `${path}.ports.${k}`,
              `the port map of "${label}" maps our ports ${theirs.get(v)} and ${k} to the same port ${v} of the file; each of our ports needs a port of its own`,
            );
          }
          theirs.set(v, k);
        }
        if (source.kind === 'part') {
          ok = false;
          err(
            'bad-value',
            `${path}#ports`,
            `candidate "${label}" is a catalog part: its ports are numbered by its part file; a port map belongs to files from elsewhere`,
          );
        }
        if (ok) portMap = entries.map(([, v]) => v as number);
      }
      candidates.push({ label, vendor: text(c.vendor), notes: text(c.notes), source, portMap, portsAt: at(`${path}.ports`), at: at(path) });
    });
  }

  let baseline: string | null = null;
  if (typeof spec.baseline === 'string') {
    if (labels.has(spec.baseline)) baseline = spec.baseline;
    else
      err(
        'bad-value',
        'baseline',
        `baseline "${spec.baseline}" is not the label of a candidate; the candidates are ${[...labels.keys()].map((l) => `"${l}"`).join(', ') || 'none'}`,
      );
  }

  errors.sort((a, b) => a.line - b.line || a.column - b.column);
  if (errors.length || !requirement.value) return { value: null, errors };
  return {
    value: {
      file,
      title: text(spec.title) ?? '',
      description: text(spec.description),
      date: text(spec.date),
      referenceOhms,
      requirement: requirement.value,
      candidates,
      baseline,
    },
    errors: [],
  };
}
