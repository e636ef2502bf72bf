/**
 * The part file as written (validated against the schema) → NormalizedPart:
 * quantities in base units (Hz, dB, deg, s), parameters parsed, figures and
 * bands resolved, defaults filled in. Every problem is collected, each at its
 * line and column; nothing is thrown. Each part of the file has a module of
 * its own (bands.ts, measurements.ts, custom-figures.ts, checks.ts for limits
 * and reported figures, context.ts for what they share); this one holds the
 * types and puts the parts together.
 */
import type { ExpressionCompiler } from '../figures/expression.js';
import type { FigureDef, Item } from '../figures/types.js';
import { nearest } from '../format/suggest.js';
import type { Position, SpecError } from './diagnostics.js';
import type { Assurance, PartClass } from './part-schema.js';
import { parseQuantity } from './quantity.js';
import type { Plain } from './validate.js';
import { normalizeBands } from './bands.js';
import { normalizeCheck, type CheckScope } from './checks.js';
import { contextOf, isObj, str } from './context.js';
import { normalizeCustomFigures } from './custom-figures.js';
import { normalizeMeasurements } from './measurements.js';

export interface NormalizedBand {
  readonly name: string;
  readonly fromHz: number;
  readonly toHz: number;
  readonly at: Position;
}

export interface NormalizedMeasurement {
  /** The serial number as written. */
  readonly unit: string;
  /** How results name this measurement: the serial, or serial @ conditions where the serial repeats. */
  readonly label: string;
  /** As written in the part file, relative to it. */
  readonly file: string;
  readonly conditions: Readonly<Record<string, string>>;
  readonly notes: string | null;
  /** Measurement metadata, as written (each optional). */
  readonly instrument: string | null;
  readonly calibration: string | null;
  readonly date: string | null;
  readonly operator: string | null;
  /** The production lot, as written, or null. */
  readonly lot: string | null;
  readonly at: Position;
  readonly fileAt: Position;
}

export interface Limit {
  readonly max?: number;
  readonly min?: number;
  readonly nominal?: number;
  readonly tolerance?: number;
}

export interface NormalizedCheck {
  readonly kind: 'limit' | 'report';
  readonly figure: FigureDef;
  readonly items: readonly Item[];
  /** The parameters the result covers, named as in the trade (stability: the four of the port pair). */
  readonly on: readonly string[];
  readonly band: NormalizedBand;
  readonly limit: Limit | null;
  /** The nominal the figure works around (the limit's, or the figure's default), or null. */
  readonly nominal: number | null;
  readonly when: Readonly<Record<string, string>> | null;
  readonly aperture: number;
  readonly levelDb: number;
  readonly label: string;
  /** How the vendor assures the limit (assured-by), or null: checked on the listed units only. */
  readonly assuredBy: Assurance | null;
  /** Qualification: the limit bounds the change per unit from one stage to another (later minus earlier), or null. */
  readonly change: Change | null;
  readonly at: Position;
  readonly onAt: Position;
}

/** Two stages of a qualification sequence, each the conditions its measurements carry. */
export interface Change {
  readonly from: Readonly<Record<string, string>>;
  readonly to: Readonly<Record<string, string>>;
}

/** A specification the vendor declares (no Touchstone file carries it): values as written. */
export interface DeclaredSpec {
  readonly parameter: string;
  readonly min: string | null;
  readonly typ: string | null;
  readonly max: string | null;
  readonly unit: string;
  readonly conditions: string | null;
}

export interface NormalizedPart {
  readonly file: string;
  readonly part: string;
  readonly title: string;
  readonly partClass: PartClass;
  readonly revision: string;
  /** Where revision is written (or the file's start when it is not). */
  readonly revisionAt: Position;
  readonly date: string | null;
  readonly vendor: string | null;
  readonly description: string | null;
  readonly notes: string | null;
  readonly packageText: string | null;
  readonly connector: string | null;
  readonly operatingTemperature: string | null;
  readonly portNames: Readonly<Record<number, string>>;
  /** Where each port's name is written (its key), for errors once the port count is known. */
  readonly portNamesAt: Readonly<Record<number, Position>>;
  readonly ways: number | null;
  readonly phaseSplitDeg: number | null;
  /** Single-ended port pairs of the mixed-mode ports, or null. */
  readonly mixedModePairs: ReadonlyArray<readonly [number, number]> | null;
  readonly mixedModeAt: Position;
  readonly measurements: readonly NormalizedMeasurement[];
  /** typical-at: the conditions typical values are quoted at, or null (all units). */
  readonly typicalAt: Readonly<Record<string, string>> | null;
  readonly bands: ReadonlyMap<string, NormalizedBand>;
  readonly checks: readonly NormalizedCheck[];
  readonly ratings: ReadonlyArray<{ readonly parameter: string; readonly value: string; readonly notes: string | null }>;
  readonly cautions: readonly string[];
  /** operating-band, resolved (null: the class's default, chosen where the limits are known). */
  readonly operatingBand: NormalizedBand | null;
  readonly features: readonly string[];
  readonly weight: string | null;
  /** outline: an image path relative to the content folder (checked by the shell), and where it is written. */
  readonly outline: string | null;
  readonly outlineAt: Position;
  readonly ordering: ReadonlyArray<{ readonly code: string; readonly description: string }>;
  readonly declared: ReadonlyArray<DeclaredSpec>;
  /** The part file as written (after schema checks), for pages that show it. */
  readonly spec: Readonly<Record<string, Plain>>;
}

export interface NormalizeInput {
  readonly file: string;
  readonly value: Plain;
  readonly positions: ReadonlyMap<string, Position>;
  /** Needed only when the part has custom figures. */
  readonly compile?: ExpressionCompiler;
}

export function normalizePart(input: NormalizeInput): { value: NormalizedPart | null; errors: SpecError[]; needsCompiler?: true } {
  const ctx = contextOf(input.file, input.positions);
  const { errors, at, err } = ctx;
  const spec = isObj(input.value) ? input.value : {};

  const { bands, brokenBands } = normalizeBands(spec, ctx);

  const partClass = (typeof spec.class === 'string' ? spec.class : 'generic') as PartClass;
  const ways = typeof spec.ways === 'number' ? spec.ways : null;
  const split = typeof spec['phase-split'] === 'string' || typeof spec['phase-split'] === 'number' ? parseQuantity(spec['phase-split']) : null;
  const phaseSplitDeg = split && split.ok ? split.value : null;
  const partCtx = { partClass, ways, phaseSplitDeg };
  const mm = spec['mixed-mode'];
  const mixedModePairs =
    isObj(mm) && Array.isArray(mm.pairs) ? (mm.pairs.filter((p) => Array.isArray(p) && p.length === 2) as unknown as Array<[number, number]>) : null;
  if (mixedModePairs) {
    const used = mixedModePairs.flat();
    if (new Set(used).size !== used.length)
      err('bad-value', 'mixed-mode.pairs', 'a port appears in two mixed-mode pairs; each single-ended port belongs to one pair');
  }

  const { measurements, typicalAt } = normalizeMeasurements(spec, ctx);
  const { custom, brokenCustom, needsCompiler } = normalizeCustomFigures(spec, input.compile, ctx);

  // checks: limits, then reported figures
  const checks: NormalizedCheck[] = [];
  const scope: CheckScope = { ctx, bands, brokenBands, custom, brokenCustom, partCtx, measurements };
  for (const kind of ['limit', 'report'] as const) {
    const list = spec[kind === 'limit' ? 'limits' : 'report'];
    if (!Array.isArray(list)) continue;
    list.forEach((entry, i) => {
      if (!isObj(entry)) return;
      const c = normalizeCheck(kind, entry, `${kind === 'limit' ? 'limits' : 'report'}.${i}`, scope);
      if (c) checks.push(c);
    });
  }

  const portNames: Record<number, string> = {};
  const portNamesAt: Record<number, Position> = {};
  if (isObj(spec.ports)) {
    for (const [k, v] of Object.entries(spec.ports)) {
      if (typeof v !== 'string') continue;
      portNames[Number(k)] = v;
      portNamesAt[Number(k)] = at(`ports#${k}`);
    }
  }
  const ratings = Array.isArray(spec.ratings)
    ? spec.ratings.filter(isObj).map((r) => ({ parameter: String(r.parameter ?? ''), value: String(r.value ?? ''), notes: str(r.notes) }))
    : [];
  let operatingBand: NormalizedBand | null = null;
  if (typeof spec['operating-band'] === 'string') {
    const name = spec['operating-band'];
    operatingBand = bands.get(name) ?? null;
    if (!operatingBand && !brokenBands.has(name)) {
      const near = nearest(name, bands.keys());
      err(
        'unknown-band',
        'operating-band',
        `operating-band "${name}" is not a band of this part${near ? `; did you mean "${near}"?` : bands.size ? `; the bands are ${[...bands.keys()].join(', ')}` : '; define it under bands:'}`,
      );
    }
  }
  const plainText = (v: Plain | undefined) => (v === undefined || v === null ? null : String(v));
  const value: NormalizedPart = {
    file: input.file,
    part: str(spec.part) ?? '',
    title: str(spec.title) ?? '',
    partClass,
    revision: str(spec.revision) ?? '',
    revisionAt: at('revision'),
    date: str(spec.date),
    vendor: str(spec.vendor),
    description: str(spec.description),
    notes: str(spec.notes),
    packageText: str(spec.package),
    connector: str(spec.connector),
    operatingTemperature: str(spec['operating-temperature']),
    portNames,
    portNamesAt,
    ways,
    phaseSplitDeg,
    mixedModePairs,
    mixedModeAt: at('mixed-mode'),
    measurements,
    typicalAt,
    bands,
    checks,
    ratings,
    cautions: Array.isArray(spec.cautions) ? spec.cautions.filter((c): c is string => typeof c === 'string') : [],
    operatingBand,
    features: Array.isArray(spec.features) ? spec.features.filter((c): c is string => typeof c === 'string') : [],
    weight: str(spec.weight),
    outline: str(spec.outline),
    outlineAt: at('outline'),
    ordering: Array.isArray(spec.ordering)
      ? spec.ordering.filter(isObj).map((o) => ({ code: String(o.code ?? ''), description: String(o.description ?? '') }))
      : [],
    declared: Array.isArray(spec.declared)
      ? spec.declared.filter(isObj).map((d) => ({
          parameter: String(d.parameter ?? ''),
          min: plainText(d.min),
          typ: plainText(d.typ),
          max: plainText(d.max),
          unit: String(d.unit ?? ''),
          conditions: str(d.conditions),
        }))
      : [],
    spec,
  };
  if (needsCompiler) return { value: null, errors: [], needsCompiler };
  return { value: errors.length ? null : value, errors };
}
