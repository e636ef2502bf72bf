/**
 * The part file as written (validated against the schema) → NormalizedPart:
 * quantities in base units (Hz, dB, deg, s), parameters parsed, figures and
 * bands resolved, defaults filled in. Every problem is collected, each at its
 * line and column; nothing is thrown.
 */
import { FIGURES } from '../figures/registry.js';
import type { CompiledExpression, ExpressionCompiler } from '../figures/expression.js';
import type { FigureDef, FigureUnit, Item } from '../figures/types.js';
import { nearest } from '../format/suggest.js';
import type { Position, SpecError, SpecErrorCode } from './diagnostics.js';
import { parameterName, parseParameter, type SParameter } from './parameter.js';
import { MAX_LEVEL_DB, type Assurance, type PartClass } from './part-schema.js';
import { parseQuantity, KIND_NAMES, type QuantityKind } from './quantity.js';
import type { Plain } from './validate.js';

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

const KIND_OF_UNIT: Record<FigureUnit, QuantityKind> = { dB: 'dB', deg: 'deg', s: 'time', Hz: 'frequency', '': 'unitless' };

export function conditionText(v: Plain): string {
  return String(v).trim().replace(/\s+/g, ' ');
}

type Obj = Record<string, Plain>;
const isObj = (v: Plain | undefined): v is Obj => typeof v === 'object' && v !== null && !Array.isArray(v);
const str = (v: Plain | undefined): string | null => (typeof v === 'string' ? v : typeof v === 'number' ? String(v) : null);

export interface NormalizeInput {
  readonly file: string;
  readonly value: Plain;
  readonly positions: ReadonlyMap<string, Position>;
  /** Needed only when the part has custom figures. */
  readonly compile?: ExpressionCompiler;
}

export function normalizePart(input: NormalizeInput): { value: NormalizedPart | null; errors: SpecError[]; needsCompiler?: true } {
  const errors: SpecError[] = [];
  const at = (path: string): Position => input.positions.get(path) ?? { line: 0, column: 0 };
  const err = (code: SpecErrorCode, path: string, message: string) => errors.push({ code, file: input.file, message, ...at(path) });
  const spec = isObj(input.value) ? input.value : {};

  // bands
  const bands = new Map<string, NormalizedBand>();
  /** Bands that are named but broken: their errors are reported once, not again at every use. */
  const brokenBands = new Set<string>();
  if (isObj(spec.bands)) {
    for (const name of Object.keys(spec.bands)) brokenBands.add(name);
    for (const [name, b] of Object.entries(spec.bands)) {
      if (!isObj(b) || b.from === undefined || b.to === undefined) continue;
      const from = parseQuantity(b.from as string), to = parseQuantity(b.to as string);
      if (!from.ok || !to.ok) continue;
      if (from.value < 0) {
        err('bad-value', `bands.${name}.from`, `band ${name} starts at a negative frequency (${b.from}); frequencies are 0 Hz or above`);
        continue;
      }
      if (to.value < from.value) {
        err('bad-value', `bands.${name}.to`, `band ${name} ends below where it starts (${b.from} to ${b.to}); from ≤ to (equal for a single frequency)`);
        continue;
      }
      bands.set(name, { name, fromHz: from.value, toHz: to.value, at: at(`bands.${name}`) });
      brokenBands.delete(name);
    }
  }

  const partClass = (typeof spec.class === 'string' ? spec.class : 'generic') as PartClass;
  const ways = typeof spec.ways === 'number' ? spec.ways : null;
  const split = typeof spec['phase-split'] === 'string' || typeof spec['phase-split'] === 'number' ? parseQuantity(spec['phase-split']) : null;
  const phaseSplitDeg = split && split.ok ? split.value : null;
  const partCtx = { partClass, ways, phaseSplitDeg };
  const mm = spec['mixed-mode'];
  const mixedModePairs = isObj(mm) && Array.isArray(mm.pairs) ? (mm.pairs.filter((p) => Array.isArray(p) && p.length === 2) as unknown as Array<[number, number]>) : null;
  if (mixedModePairs) {
    const used = mixedModePairs.flat();
    if (new Set(used).size !== used.length) err('bad-value', 'mixed-mode.pairs', 'a port appears in two mixed-mode pairs; each single-ended port belongs to one pair');
  }

  // measurements: a serial may appear several times under different conditions (temperature corners)
  const measurements: NormalizedMeasurement[] = [];
  const seen = new Map<string, number>();
  if (Array.isArray(spec.measurements)) {
    spec.measurements.forEach((m, i) => {
      if (!isObj(m) || str(m.unit) === null || typeof m.file !== 'string') return;
      const unit = str(m.unit) as string;
      const conditions: Record<string, string> = {};
      if (isObj(m.conditions)) for (const [k, v] of Object.entries(m.conditions)) conditions[k] = conditionText(v);
      const key = `${unit}\u0000${JSON.stringify(Object.entries(conditions).sort())}`;
      if (seen.has(key)) err('duplicate', `measurements.${i}.unit`, `unit ${unit} is listed twice under the same conditions (entries ${(seen.get(key) as number) + 1} and ${i + 1}); list each measurement once`);
      seen.set(key, i);
      measurements.push({ unit, label: unit, file: m.file, conditions, notes: str(m.notes), instrument: str(m.instrument), calibration: str(m.calibration), date: str(m.date), operator: str(m.operator), lot: str(m.lot), at: at(`measurements.${i}`), fileAt: at(`measurements.${i}.file`) });
    });
  }
  // where a serial repeats, results name the measurement by serial and conditions: "SN3001 @ 85 °C"
  const count = new Map<string, number>();
  for (const m of measurements) count.set(m.unit, (count.get(m.unit) ?? 0) + 1);
  for (const [i, m] of measurements.entries()) {
    const conds = Object.values(m.conditions);
    if ((count.get(m.unit) ?? 0) > 1 && conds.length) measurements[i] = { ...m, label: `${m.unit} @ ${conds.join(', ')}` };
  }

  // the conditions typical values are quoted at
  let typicalAt: Record<string, string> | null = null;
  if (isObj(spec['typical-at'])) {
    typicalAt = {};
    for (const [k, v] of Object.entries(spec['typical-at'])) typicalAt[k] = conditionText(v);
    const wanted = typicalAt;
    if (!measurements.some((m) => Object.entries(wanted).every(([k, v]) => m.conditions[k] === v))) {
      err('unknown-condition', 'typical-at', `no measured unit has the conditions of typical-at (${Object.entries(wanted).map(([k, v]) => `${k}: ${v}`).join(', ')}); typical values must come from measured units`);
    }
  }

  // custom figures
  let needsCompiler = false;
  const custom = new Map<string, FigureDef>();
  const brokenCustom = new Set<string>();
  if (isObj(spec['custom-figures'])) {
    for (const [name, c] of Object.entries(spec['custom-figures'])) {
      if (!isObj(c) || typeof c.expression !== 'string' || typeof c.unit !== 'string' || typeof c.worse !== 'string') continue;
      if (FIGURES.has(name)) {
        err('duplicate', `custom-figures#${name}`, `custom figure "${name}" has the name of a built-in figure; choose another name`);
        continue;
      }
      if (!input.compile) {
        needsCompiler = true; // the caller loads the expression compiler and asks again
        continue;
      }
      const compiled = input.compile(c.expression);
      if (!compiled.ok) {
        err('bad-expression', `custom-figures.${name}.expression`, compiled.message);
        brokenCustom.add(name);
        continue;
      }
      custom.set(name, customFigure(name, c, compiled.value));
    }
  }

  // checks: limits, then reported figures
  const checks: NormalizedCheck[] = [];
  for (const kind of ['limit', 'report'] as const) {
    const list = spec[kind === 'limit' ? 'limits' : 'report'];
    if (!Array.isArray(list)) continue;
    list.forEach((entry, i) => {
      if (!isObj(entry)) return;
      const c = normalizeCheck(kind, entry, `${kind === 'limit' ? 'limits' : 'report'}.${i}`);
      if (c) checks.push(c);
    });
  }

  function normalizeCheck(kind: 'limit' | 'report', e: Obj, path: string): NormalizedCheck | null {
    const before = errors.length;
    const figureName = typeof e.figure === 'string' ? e.figure : '';
    const figure = FIGURES.get(figureName) ?? custom.get(figureName);
    if (!figure && brokenCustom.has(figureName)) return null; // its expression's error is reported already
    if (!figure) {
      const near = nearest(figureName, [...FIGURES.keys(), ...custom.keys()]);
      err('unknown-figure', `${path}.figure`, `unknown figure "${figureName}"${near ? `; did you mean "${near}"?` : `; expected one of ${[...FIGURES.keys()].join(', ')}${custom.size ? ` or a custom figure (${[...custom.keys()].join(', ')})` : ''}`}`);
      return null;
    }
    const bandName = typeof e.band === 'string' ? e.band : '';
    const band = bands.get(bandName);
    if (!band && typeof e.band === 'string' && !brokenBands.has(bandName)) {
      const near = nearest(bandName, bands.keys());
      err('unknown-band', `${path}.band`, `band "${bandName}" is not defined${near ? `; did you mean "${near}"?` : bands.size ? `; the bands are ${[...bands.keys()].join(', ')}` : '; define it under bands:'}`);
    }

    // operands
    const onList = Array.isArray(e.on) ? (e.on.filter((x) => typeof x === 'string') as string[]) : figure.defaultOn ? [...figure.defaultOn] : null;
    const params: SParameter[] = [];
    if (onList) {
      onList.forEach((name, j) => {
        const p = parseParameter(name);
        if (!p.ok) err('bad-parameter', `${path}.on.${j}`, p.message);
        else params.push(p.value);
      });
    }
    let items: Item[] = [];
    let on: string[] = [];
    switch (figure.operands) {
      case 'each':
        if (!onList) err('missing-key', path, `${figure.id} needs "on": the S-parameter(s) it covers, e.g. on: S21`);
        items = params.map((p) => ({ params: [p], label: parameterName(p) }));
        on = items.map((it) => it.label);
        break;
      case 'pair':
        if (!onList) err('missing-key', path, `${figure.id} needs "on": two S-parameters [A, B], e.g. on: [S21, S31]`);
        else if (onList.length !== 2) err('bad-parameter', `${path}.on`, `${figure.id} takes exactly two S-parameters [A, B], got ${onList.length}`);
        if (params.length === 2) items = [{ params, label: params.map(parameterName).join('/') }];
        on = params.map(parameterName);
        break;
      case 'port-pair': {
        if (onList) err('bad-parameter', `${path}.on`, `${figure.id} is computed from the four S-parameters of a port pair: give ports: [a, b] (default [1, 2]) instead of on`);
        const ports = Array.isArray(e.ports) && e.ports.length === 2 ? (e.ports as number[]) : [1, 2];
        if (ports[0] === ports[1]) err('bad-value', `${path}.ports`, `${figure.id} needs two different ports`);
        const [a, b] = ports;
        const four: SParameter[] = [{ to: a, from: a }, { to: b, from: a }, { to: a, from: b }, { to: b, from: b }];
        items = [{ params: four, label: four.map(parameterName).join('/') }];
        on = four.map(parameterName);
        break;
      }
      case 'expression': {
        if (onList) err('bad-parameter', `${path}.on`, `${figure.id} is a custom figure: its expression names the parameters, so it takes no "on"`);
        const ps = (figure as CustomFigureDef).compiled.params;
        items = [{ params: ps, label: (figure as CustomFigureDef).expression }];
        on = [...new Set(ps.map(parameterName))];
        break;
      }
    }
    if (params.some((p) => p.mode) && params.some((p) => !p.mode)) err('bad-parameter', `${path}.on`, `${figure.id} mixes mixed-mode and single-ended parameters; give them in separate limits`);
    if (e.ports !== undefined && figure.operands !== 'port-pair') err('bad-value', `${path}.ports`, `"ports" belongs to the stability figures; ${figure.id} takes "on"`);
    if (e.aperture !== undefined && !figure.accepts?.includes('aperture')) err('bad-value', `${path}.aperture`, `"aperture" belongs to group-delay figures; ${figure.id} has none`);
    if (e.level !== undefined && !figure.accepts?.includes('level')) err('bad-value', `${path}.level`, `"level" belongs to bandwidth and center-frequency; ${figure.id} has none`);

    // limit values: each must carry the figure's unit
    const want = KIND_OF_UNIT[figure.unit];
    const value = (key: 'max' | 'min' | 'nominal' | 'tolerance'): number | undefined => {
      const raw = e[key];
      if (raw === undefined || raw === null) return undefined;
      const q = parseQuantity(raw as string | number);
      if (!q.ok) return undefined; // reported by the schema check
      if (q.kind !== want) {
        const p = `${path}.${key}`;
        if (q.kind === 'unitless' && want === 'frequency') err('bare-frequency', p, `${key} ${raw} of ${figure.id} has no unit; a frequency always carries one (Hz, kHz, MHz, GHz)`);
        else if (q.kind === 'unitless') err('missing-unit', p, `${key} ${raw} of ${figure.id} has no unit; ${figure.id} is in ${figure.unit}: write ${raw} ${figure.unit === 's' ? 'ns' : figure.unit}`);
        else err('unit-mismatch', p, `${key} "${raw}" of ${figure.id} is ${KIND_NAMES[q.kind]}; ${figure.id} is ${KIND_NAMES[want]}`);
        return undefined;
      }
      return q.value;
    };
    let limit: Limit | null = null;
    let nominal: number | null = null;
    const bandCtx = band ?? { fromHz: 0, toHz: 0 };
    if (kind === 'limit') {
      const max = value('max'), min = value('min'), nom = value('nominal'), tol = value('tolerance');
      // a key written with a value the schema refused counts as given: its own error says what is wrong
      const written = (k: string) => e[k] !== undefined || input.positions.has(`${path}#${k}`);
      const hasTol = written('tolerance');
      if (!written('max') && !written('min') && !hasTol) {
        err('bad-limit', path, `limit on ${figure.id} gives no max, min or tolerance; expected max, min, both, or nominal ± tolerance (to report a figure without a limit, list it under report:)`);
      } else if (hasTol && (written('max') || written('min'))) {
        err('bad-limit', path, `limit on ${figure.id} mixes tolerance with max/min; give either max/min or nominal ± tolerance`);
      } else if (written('nominal') && !hasTol) {
        err('bad-limit', `${path}.nominal`, `nominal without tolerance: give tolerance, the half-width of the allowed window`);
      } else if (hasTol) {
        const n = nom ?? figure.defaultNominal?.({ part: partCtx, band: bandCtx });
        if (n === undefined && e.nominal === undefined) err('bad-limit', `${path}.tolerance`, `${figure.id} has no default nominal; give nominal with the tolerance`);
        if (tol !== undefined && tol < 0) err('bad-limit', `${path}.tolerance`, 'tolerance must not be negative');
        if (n !== undefined && tol !== undefined) {
          limit = { nominal: n, tolerance: tol };
          nominal = n;
        }
      } else {
        if (max !== undefined && min !== undefined && max < min) err('bad-limit', path, `max ${e.max} is below min ${e.min}`);
        limit = { ...(max !== undefined ? { max } : {}), ...(min !== undefined ? { min } : {}) };
      }
    }
    if (nominal === null && figure.defaultNominal) nominal = figure.defaultNominal({ part: partCtx, band: bandCtx }) ?? null;

    // conditions
    let when: Record<string, string> | null = null;
    if (isObj(e.when)) {
      when = {};
      for (const [k, v] of Object.entries(e.when)) {
        const text = conditionText(v);
        when[k] = text;
        if (!measurements.some((m) => m.conditions[k] === text)) {
          const known = [...new Set(measurements.map((m) => m.conditions[k]).filter((x) => x !== undefined))];
          err('unknown-condition', `${path}.when.${k}`, `no measured unit has ${k}: ${text}${known.length ? `; the units have ${k} ${known.join(', ')}` : `; no unit lists the condition "${k}"`}`);
        }
      }
    }
    let change: Change | null = null;
    if (isObj(e.change) && isObj(e.change.from) && isObj(e.change.to)) {
      const stage = (key: 'from' | 'to') => {
        const out: Record<string, string> = {};
        for (const [k, v] of Object.entries((e.change as Obj)[key] as Obj)) {
          out[k] = conditionText(v);
          if (!measurements.some((m) => m.conditions[k] === out[k])) {
            const known = [...new Set(measurements.map((m) => m.conditions[k]).filter((x) => x !== undefined))];
            err('unknown-condition', `${path}.change.${key}.${k}`, `no measured unit has ${k}: ${out[k]}${known.length ? `; the units have ${k} ${known.join(', ')}` : `; no unit lists the condition "${k}"`}`);
          }
        }
        return out;
      };
      change = { from: stage('from'), to: stage('to') };
      if (figure.shape !== 'trace') err('bad-limit', `${path}.change`, `a change limit compares a figure point by point between two stages, and ${figure.id} has one value per unit; use a figure with a value at every point (e.g. insertion-loss)`);
      if (e.when !== undefined) err('bad-limit', `${path}.when`, 'a change limit takes its units from its two stages; leave when out');
      if (kind !== 'limit') err('bad-limit', `${path}.change`, 'change belongs to limits');
    }
    const levelQ = e.level !== undefined ? parseQuantity(e.level as string) : null;
    if (levelQ && levelQ.ok && !(levelQ.value > 0 && levelQ.value <= MAX_LEVEL_DB)) {
      err('bad-value', `${path}.level`, `level ${e.level} is out of range: the band edges sit above 0 dB and at most ${MAX_LEVEL_DB} dB below the best insertion loss (the usual values are 0.5, 1 and 3 dB)`);
    }
    if (errors.length > before || !band) return null;
    return {
      kind,
      figure,
      items,
      on,
      band,
      limit,
      nominal,
      when,
      aperture: typeof e.aperture === 'number' ? e.aperture : 1,
      levelDb: levelQ && levelQ.ok ? levelQ.value : 3,
      label: typeof e.label === 'string' ? e.label : figure.title,
      assuredBy: typeof e['assured-by'] === 'string' ? (e['assured-by'] as Assurance) : null,
      change,
      at: at(path),
      onAt: at(`${path}.on`).line ? at(`${path}.on`) : at(path),
    };
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
      err('unknown-band', 'operating-band', `operating-band "${name}" is not a band of this part${near ? `; did you mean "${near}"?` : bands.size ? `; the bands are ${[...bands.keys()].join(', ')}` : '; define it under bands:'}`);
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
    ordering: Array.isArray(spec.ordering) ? spec.ordering.filter(isObj).map((o) => ({ code: String(o.code ?? ''), description: String(o.description ?? '') })) : [],
    declared: Array.isArray(spec.declared)
      ? spec.declared.filter(isObj).map((d) => ({ parameter: String(d.parameter ?? ''), min: plainText(d.min), typ: plainText(d.typ), max: plainText(d.max), unit: String(d.unit ?? ''), conditions: str(d.conditions) }))
      : [],
    spec,
  };
  if (needsCompiler) return { value: null, errors: [], needsCompiler };
  return { value: errors.length ? null : value, errors };
}

export interface CustomFigureDef extends FigureDef {
  readonly expression: string;
  readonly compiled: CompiledExpression;
}

function customFigure(name: string, c: Obj, compiled: CompiledExpression): CustomFigureDef {
  return {
    id: name,
    title: typeof c.title === 'string' ? c.title : name,
    unit: c.unit as FigureUnit,
    operands: 'expression',
    shape: 'trace',
    worse: c.worse === 'lower' ? 'lower' : 'higher',
    definition: `custom: ${c.expression as string}`,
    expression: c.expression as string,
    compiled,
    perPoint: (ctx) => compiled.evaluate(ctx),
  };
}
