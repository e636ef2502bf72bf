/**
 * One limit or reported figure of the part file → NormalizedCheck: the figure
 * and its operands, the band, the limit values in the figure's unit, the
 * conditions it applies under (when), a change between two stages.
 */
import { FIGURES } from '../figures/registry.js';
import type { FigureDef, FigureUnit, Item } from '../figures/types.js';
import { nearest } from '../format/suggest.js';
import type { Change, Limit, NormalizedBand, NormalizedCheck, NormalizedMeasurement } from './normalize.js';
import type { CustomFigureDef } from './custom-figures.js';
import { conditionText, isObj, type Context, type Obj } from './context.js';
import { parameterName, parseParameter, type SParameter } from './parameter.js';
import { MAX_LEVEL_DB, type Assurance, type PartClass } from './part-schema.js';
import { parseQuantity, KIND_NAMES, type QuantityKind } from './quantity.js';

const KIND_OF_UNIT: Record<FigureUnit, QuantityKind> = { dB: 'dB', deg: 'deg', s: 'time', Hz: 'frequency', '': 'unitless' };

/** What a check is resolved against. */
export interface CheckScope {
  readonly ctx: Context;
  readonly bands: ReadonlyMap<string, NormalizedBand>;
  readonly brokenBands: ReadonlySet<string>;
  readonly custom: ReadonlyMap<string, FigureDef>;
  readonly brokenCustom: ReadonlySet<string>;
  readonly partCtx: { readonly partClass: PartClass; readonly ways: number | null; readonly phaseSplitDeg: number | null };
  readonly measurements: readonly NormalizedMeasurement[];
}

export function normalizeCheck(kind: 'limit' | 'report', e: Obj, path: string, scope: CheckScope): NormalizedCheck | null {
  const { ctx, bands, brokenBands, custom, brokenCustom, partCtx, measurements } = scope;
  const { err, at } = ctx;
  const before = ctx.errors.length;
  const figureName = typeof e.figure === 'string' ? e.figure : '';
  const figure = FIGURES.get(figureName) ?? custom.get(figureName);
  if (!figure && brokenCustom.has(figureName)) return null; // its expression's error is reported already
  if (!figure) {
    const near = nearest(figureName, [...FIGURES.keys(), ...custom.keys()]);
    err(
      'unknown-figure',
      `${path}.figure`,
      `unknown figure "${figureName}"${near ? `; did you mean "${near}"?` : `; expected one of ${[...FIGURES.keys()].join(', ')}${custom.size ? ` or a custom figure (${[...custom.keys()].join(', ')})` : ''}`}`,
    );
    return null;
  }
  const bandName = typeof e.band === 'string' ? e.band : '';
  const band = bands.get(bandName);
  if (!band && typeof e.band === 'string' && !brokenBands.has(bandName)) {
    const near = nearest(bandName, bands.keys());
    err(
      'unknown-band',
      `${path}.band`,
      `band "${bandName}" is not defined${near ? `; did you mean "${near}"?` : bands.size ? `; the bands are ${[...bands.keys()].join(', ')}` : '; define it under bands:'}`,
    );
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
      if (onList)
        err(
          'bad-parameter',
          `${path}.on`,
          `${figure.id} is computed from the four S-parameters of a port pair: give ports: [a, b] (default [1, 2]) instead of on`,
        );
      const ports = Array.isArray(e.ports) && e.ports.length === 2 ? (e.ports as number[]) : [1, 2];
      if (ports[0] === ports[1]) err('bad-value', `${path}.ports`, `${figure.id} needs two different ports`);
      const [a, b] = ports;
      const four: SParameter[] = [
        { to: a, from: a },
        { to: b, from: a },
        { to: a, from: b },
        { to: b, from: b },
      ];
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
  if (params.some((p) => p.mode) && params.some((p) => !p.mode))
    err('bad-parameter', `${path}.on`, `${figure.id} mixes mixed-mode and single-ended parameters; give them in separate limits`);
  if (e.ports !== undefined && figure.operands !== 'port-pair')
    err('bad-value', `${path}.ports`, `"ports" belongs to the stability figures; ${figure.id} takes "on"`);
  if (e.aperture !== undefined && !figure.accepts?.includes('aperture'))
    err('bad-value', `${path}.aperture`, `"aperture" belongs to group-delay figures; ${figure.id} has none`);
  if (e.level !== undefined && !figure.accepts?.includes('level'))
    err('bad-value', `${path}.level`, `"level" belongs to bandwidth and center-frequency; ${figure.id} has none`);

  // limit values: each must carry the figure's unit
  const want = KIND_OF_UNIT[figure.unit];
  const value = (key: 'max' | 'min' | 'nominal' | 'tolerance'): number | undefined => {
    const raw = e[key];
    if (raw === undefined || raw === null) return undefined;
    const q = parseQuantity(raw as string | number);
    if (!q.ok) return undefined; // reported by the schema check
    if (q.kind !== want) {
      const p = `${path}.${key}`;
      if (q.kind === 'unitless' && want === 'frequency')
        err('bare-frequency', p, `${key} ${raw} of ${figure.id} has no unit; a frequency always carries one (Hz, kHz, MHz, GHz)`);
      else if (q.kind === 'unitless')
        err(
          'missing-unit',
          p,
          `${key} ${raw} of ${figure.id} has no unit; ${figure.id} is in ${figure.unit}: write ${raw} ${figure.unit === 's' ? 'ns' : figure.unit}`,
        );
      else err('unit-mismatch', p, `${key} "${raw}" of ${figure.id} is ${KIND_NAMES[q.kind]}; ${figure.id} is ${KIND_NAMES[want]}`);
      return undefined;
    }
    return q.value;
  };
  let limit: Limit | null = null;
  let nominal: number | null = null;
  const bandCtx = band ?? { fromHz: 0, toHz: 0 };
  if (kind === 'limit') {
    const max = value('max'),
      min = value('min'),
      nom = value('nominal'),
      tol = value('tolerance');
    // a key written with a value the schema refused counts as given: its own error says what is wrong
    const written = (k: string) => e[k] !== undefined || ctx.positions.has(`${path}#${k}`);
    const hasTol = written('tolerance');
    if (!written('max') && !written('min') && !hasTol) {
      err(
        'bad-limit',
        path,
        `limit on ${figure.id} gives no max, min or tolerance; expected max, min, both, or nominal ± tolerance (to report a figure without a limit, list it under report:)`,
      );
    } else if (hasTol && (written('max') || written('min'))) {
      err('bad-limit', path, `limit on ${figure.id} mixes tolerance with max/min; give either max/min or nominal ± tolerance`);
    } else if (written('nominal') && !hasTol) {
      err('bad-limit', `${path}.nominal`, `nominal without tolerance: give tolerance, the half-width of the allowed window`);
    } else if (hasTol) {
      const n = nom ?? figure.defaultNominal?.({ part: partCtx, band: bandCtx });
      if (n === undefined && e.nominal === undefined)
        err('bad-limit', `${path}.tolerance`, `${figure.id} has no default nominal; give nominal with the tolerance`);
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
        err(
          'unknown-condition',
          `${path}.when.${k}`,
          `no measured unit has ${k}: ${text}${known.length ? `; the units have ${k} ${known.join(', ')}` : `; no unit lists the condition "${k}"`}`,
        );
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
          err(
            'unknown-condition',
            `${path}.change.${key}.${k}`,
            `no measured unit has ${k}: ${out[k]}${known.length ? `; the units have ${k} ${known.join(', ')}` : `; no unit lists the condition "${k}"`}`,
          );
        }
      }
      return out;
    };
    change = { from: stage('from'), to: stage('to') };
    if (figure.shape !== 'trace')
      err(
        'bad-limit',
        `${path}.change`,
        `a change limit compares a figure point by point between two stages, and ${figure.id} has one value per unit; use a figure with a value at every point (e.g. insertion-loss)`,
      );
    if (e.when !== undefined) err('bad-limit', `${path}.when`, 'a change limit takes its units from its two stages; leave when out');
    if (kind !== 'limit') err('bad-limit', `${path}.change`, 'change belongs to limits');
  }
  const levelQ = e.level !== undefined ? parseQuantity(e.level as string) : null;
  if (levelQ && levelQ.ok && !(levelQ.value > 0 && levelQ.value <= MAX_LEVEL_DB)) {
    err(
      'bad-value',
      `${path}.level`,
      `level ${e.level} is out of range: the band edges sit above 0 dB and at most ${MAX_LEVEL_DB} dB below the best insertion loss (the usual values are 0.5, 1 and 3 dB)`,
    );
  }
  if (ctx.errors.length > before || !band) return null;
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
