/**
 * NormalizedPart + measured networks → results, by these rules:
 *
 * - margin (positive = passing): max → max − value; min → value − min; both →
 *   the smaller of the two; nominal ± tolerance → tolerance − |value − nominal|.
 * - A unit's worst: over every point of the band set and every item of `on`,
 *   the value with the least margin; ties go to the lowest frequency, then to
 *   the first item. Without a limit, the figure's bad direction decides
 *   (highest insertion loss, lowest return loss, furthest from nominal).
 * - A result's worst: the unit worst with the least margin (ties: lowest
 *   frequency, then the first unit); typical: the worst of the median unit
 *   when the units are ranked by margin (typicalOf); pass: every unit's
 *   margin ≥ 0.
 * - `when` restricts a check to the units whose conditions match.
 * - `change` limits bound a figure's change per unit between two stages (change.ts).
 */
import { FigureUndefined, type FigureContext, type Item } from '../figures/types.js';
import { formatFrequency } from '../format/units.js';
import type { Network } from '../network/network.js';
import type { NoiseParameters } from '../touchstone/normalize.js';
import type { Position, SpecError, SpecWarning } from '../part-file/diagnostics.js';
import { classOf } from '../classes/registry.js';
import type { Change, Limit, NormalizedCheck, NormalizedPart } from '../part-file/normalize.js';
import { evaluateChange } from './change.js';
import { parameterName } from '../part-file/parameter.js';
import { bandSet } from './band.js';
import { itemOnNetwork, orderIndex, pairsOfOrder } from './mixed.js';

export interface UnitData {
  /** How results name the measurement: the serial, or "serial @ conditions" where a serial repeats. */
  readonly unit: string;
  /** The unit's serial number (where it differs from `unit`). */
  readonly serial?: string;
  readonly file: string;
  readonly network: Network;
  /** The file's noise parameters (two-ports), or none. */
  readonly noise?: NoiseParameters | null;
  /** The file's Touchstone 2 [Mixed-Mode Order] descriptors, when it was written in mixed-mode order. */
  readonly mixedModeOrder?: readonly string[] | null;
  readonly conditions: Readonly<Record<string, string>>;
  readonly fileAt: Position;
}

export interface UnitResult {
  readonly unit: string;
  readonly worst: number;
  readonly atHz: number | null;
  readonly worstOn: string;
  readonly margin: number | null;
  readonly pass: boolean | null;
}

export interface CheckResult {
  readonly kind: 'limit' | 'report';
  readonly figure: string;
  readonly label: string;
  readonly on: readonly string[];
  readonly band: string;
  readonly fromHz: number;
  readonly toHz: number;
  readonly unit: string;
  readonly limit: Limit | null;
  /** How the vendor assures the limit, or null (checked on the listed units only). */
  readonly assuredBy: NormalizedCheck['assuredBy'];
  readonly worst: number;
  readonly worstAtHz: number | null;
  readonly worstUnit: string;
  readonly worstOn: string;
  readonly typical: number;
  /** The unit whose worst is the typical value. */
  readonly typicalUnit: string;
  /** The conditions typical is quoted at (the part's typical-at, where the check has such units), or null: all its units. */
  readonly typicalAt: Readonly<Record<string, string>> | null;
  /** The units typical was taken from were measured under different conditions. */
  readonly typicalMixed: boolean;
  readonly margin: number | null;
  readonly pass: boolean | null;
  readonly units: readonly UnitResult[];
  /** A change limit's two stages (its values are changes per unit), absent otherwise. */
  readonly change?: Change;
}

export interface PartResult {
  readonly part: string;
  readonly revision: string;
  /** Every limit passes (reported figures do not count). */
  readonly pass: boolean;
  readonly results: readonly CheckResult[];
  /** What a reader of the figures must know although they evaluated (e.g. an aliased group delay). */
  readonly warnings: readonly SpecWarning[];
}

export function marginOf(limit: Limit, v: number): number {
  if (limit.tolerance !== undefined && limit.nominal !== undefined) return limit.tolerance - Math.abs(v - limit.nominal);
  let m = Infinity;
  if (limit.max !== undefined) m = Math.min(m, limit.max - v);
  if (limit.min !== undefined) m = Math.min(m, v - limit.min);
  return m;
}

/** The number that is smallest for the worst value: the margin, or the bad direction without a limit. */
export function scorer(check: NormalizedCheck): (v: number) => number {
  if (check.limit) {
    const limit = check.limit;
    return (v) => marginOf(limit, v);
  }
  switch (check.figure.worse) {
    case 'higher':
      return (v) => -v;
    case 'lower':
      return (v) => v;
    case 'nominal': {
      const nominal = check.nominal ?? 0;
      return (v) => -Math.abs(v - nominal);
    }
  }
}

class EvaluationError extends Error {
  constructor(readonly error: SpecError) {
    super(error.message);
  }
}

export function evaluatePart(part: NormalizedPart, units: readonly UnitData[]): { value: PartResult | null; errors: SpecError[] } {
  const errors: SpecError[] = [];
  const fail = (code: SpecError['code'], at: Position, message: string) => errors.push({ code, file: part.file, message, ...at });

  // every unit's file must have the same port count, and every check's ports must exist
  if (units.length > 0) {
    const n0 = units[0].network.ports;
    for (const u of units.slice(1)) {
      if (u.network.ports !== n0)
        fail(
          'port-count-mismatch',
          u.fileAt,
          `unit ${u.unit} (${u.file}) has ${u.network.ports} ports but unit ${units[0].unit} (${units[0].file}) has ${n0}; every unit of a part must have the same ports`,
        );
    }
  }
  const ports = units.length ? units[0].network.ports : 0;
  const pairs = part.mixedModePairs;
  const inOrder = units.find((u) => u.mixedModeOrder);
  if (pairs && units.length && !inOrder) {
    const used = pairs.flat();
    if (2 * pairs.length !== ports || used.some((x) => x > ports)) {
      fail('port-range', part.mixedModeAt, `mixed-mode pairs ${JSON.stringify(pairs)} must cover the ${ports} ports of the measured files exactly once`);
    } else {
      for (const u of units) {
        for (const [p, q] of pairs) {
          if (u.network.z0[p - 1] !== u.network.z0[q - 1]) {
            fail(
              'bad-value',
              part.mixedModeAt,
              `mixed-mode pair [${p}, ${q}]: ${u.file} (unit ${u.unit}) has references of ${u.network.z0[p - 1]} Ω and ${u.network.z0[q - 1]} Ω on these ports; the two ports of a pair need one reference (renormalize the file first)`,
            );
          }
        }
      }
    }
  }
  if (inOrder) {
    // files in mixed-mode order hold modes, not single-ended entries: names are looked up by descriptor, never guessed
    const order = inOrder.mixedModeOrder as readonly string[];
    const describe = `${inOrder.file} holds mixed-mode data ([Mixed-Mode Order] ${order.join(' ')})`;
    if (units.some((u) => !u.mixedModeOrder || u.mixedModeOrder.join(' ') !== order.join(' '))) {
      fail('port-count-mismatch', inOrder.fileAt, `${describe}, but not every unit's file has the same order; the units of a part must agree`);
    }
    const own = pairs ?? pairsOfOrder(order);
    for (const c of part.checks) {
      for (const item of c.items) {
        for (const p of item.params) {
          const name = parameterName(p);
          if (!p.mode) {
            fail('bad-parameter', c.onAt, `${name} names a single-ended entry, but ${describe}: name its entries by mode, e.g. Sdd21, Scd21, Scc11`);
            continue;
          }
          const to = orderIndex(order, own, p.mode[0] as 'd' | 'c', p.to),
            from = orderIndex(order, own, p.mode[1] as 'd' | 'c', p.from);
          if (to === null || from === null) fail('port-range', c.onAt, `${name} has no entry in ${inOrder.file}: its [Mixed-Mode Order] is ${order.join(' ')}`);
        }
      }
    }
  }
  if (units.length) {
    for (const [port, where] of Object.entries(part.portNamesAt)) {
      if (Number(port) > ports) fail('port-range', where, `ports names port ${port}, but the measured files have ${ports} port${ports === 1 ? '' : 's'}`);
    }
  }
  for (const c of inOrder ? [] : part.checks) {
    // (files in mixed-mode order carry their own pairing; single-ended files need the part's)
    if (!pairs && c.items.some((i) => i.params.some((p) => p.mode))) {
      fail(
        'bad-parameter',
        c.onAt,
        `mixed-mode parameters need the part's port pairs: add mixed-mode: {pairs: [[1, 2], [3, 4]]} (or measure in Touchstone 2's mixed-mode order)`,
      );
      continue;
    }
    for (const item of c.items) {
      for (const p of item.params) {
        const top = Math.max(p.to, p.from);
        if (p.mode && pairs && top > pairs.length) {
          fail('port-range', c.onAt, `${parameterName(p)} needs mixed-mode port ${top}, but mixed-mode pairs defines ${pairs.length}`);
          continue;
        }
        if (p.mode) continue;
        if (top > ports) {
          fail(
            'port-range',
            c.onAt,
            `${parameterName(p)} needs port ${top}, but the measured files have ${ports} port${ports === 1 ? '' : 's'}${c.figure.operands === 'port-pair' ? ' (set ports: [a, b] for the stability figures)' : ''}`,
          );
        }
      }
    }
  }
  if (errors.length) return { value: null, errors };

  const results: CheckResult[] = [];
  const warnings: SpecWarning[] = [];
  for (const check of part.checks) {
    if (check.change) {
      const r = evaluateChange(part, check as NormalizedCheck & { change: Change }, units, scorer(check));
      if ('error' in r) errors.push(r.error);
      else results.push(r.value);
      continue;
    }
    try {
      results.push(evaluateCheck(part, check, units, warnings));
    } catch (e) {
      if (!(e instanceof EvaluationError)) throw e;
      errors.push(e.error);
    }
  }
  // two limits over one band that no file covers give the same message at the band's line: say it once
  if (errors.length)
    return {
      value: null,
      errors: errors.filter(
        (e, i) => errors.findIndex((o) => o.line === e.line && o.column === e.column && o.file === e.file && o.message === e.message) === i,
      ),
    };
  const pass = results.every((r) => r.kind !== 'limit' || r.pass === true);
  return { value: { part: part.part, revision: part.revision, pass, results, warnings }, errors };
}

function evaluateCheck(part: NormalizedPart, check: NormalizedCheck, all: readonly UnitData[], warnings: SpecWarning[]): CheckResult {
  const problem = (code: SpecError['code'], message: string, at: Position = check.at): never => {
    throw new EvaluationError({ code, file: part.file, message, ...at });
  };
  const when = check.when;
  const units = when ? all.filter((u) => Object.entries(when).every(([k, v]) => u.conditions[k] === v)) : all;
  if (units.length === 0) problem('unknown-condition', `no measured unit matches when: ${JSON.stringify(when)}`);
  const score = scorer(check);
  const band = check.band;
  const unitResults: UnitResult[] = [];
  const onNoise = check.figure.grid === 'noise';
  for (const u of units) {
    const f =
      gridOf(check, u) ??
      problem(
        'figure-undefined',
        `${check.figure.id} needs noise parameters, and ${u.file} (unit ${u.unit}) has none (a Touchstone noise block follows the network data of a 2-port)`,
      );
    const lo = f[0],
      hi = f[f.length - 1];
    if (band.fromHz < lo || band.toHz > hi) {
      problem(
        'band-outside-data',
        `band ${band.name} (${formatFrequency(band.fromHz)} to ${formatFrequency(band.toHz)}) reaches outside the ${onNoise ? 'noise frequencies' : 'measured range'} of ${u.file} (${formatFrequency(lo)} to ${formatFrequency(hi)})`,
        band.at,
      );
    }
    const ctx: FigureContext = {
      network: u.network,
      part: { partClass: part.partClass, ways: part.ways, phaseSplitDeg: part.phaseSplitDeg },
      aperture: check.aperture,
      levelDb: check.levelDb,
      nominal: check.nominal,
      band: { fromHz: band.fromHz, toHz: band.toHz },
      noise: u.noise ?? null,
    };
    let best: { value: number; atHz: number | null; score: number; on: string } | null = null;
    let lowest: { value: number; atHz: number | null; on: string; stepHz: number | null } | null = null;
    for (const item of check.items) {
      const candidate = evaluateItem(check, ctx, item, u, score, problem, part.mixedModePairs);
      if (!lowest || candidate.lowest.value < lowest.value) lowest = { ...candidate.lowest, on: candidate.on };
      if (
        !best ||
        candidate.score < best.score ||
        (candidate.score === best.score && candidate.atHz !== null && best.atHz !== null && candidate.atHz < best.atHz)
      ) {
        best = candidate;
      }
    }
    const b = best as NonNullable<typeof best>;
    const low = lowest as NonNullable<typeof lowest>;
    if (low.value < 0 && classOf(part.partClass).passive) {
      // excess loss: below −0.1 dB, beyond a network analyser's usual transmission uncertainty (common practice)
      const at = low.atHz === null ? '' : ` at ${formatFrequency(low.atHz)}`;
      if (check.figure.id === 'excess-loss' && low.value < -0.1) {
        warnings.push({
          code: 'negative-excess-loss',
          file: part.file,
          ...check.at,
          message: `excess loss of unit ${u.unit} on ${low.on} comes out negative (${trimValue(low.value)} dB${at}) on a passive part, which cannot beat the ideal split: is ways (N = ${part.ways ?? classOf(part.partClass).ways(u.network.ports)}) right for it?`,
        });
      }
      if (check.figure.id === 'group-delay' || check.figure.id === 'group-delay-variation') {
        const df = low.stepHz;
        warnings.push({
          code: 'delay-aliased',
          file: part.file,
          ...check.at,
          message: `group delay of unit ${u.unit} on ${low.on} comes out negative (${trimValue(low.value * 1e9)} ns${at}) on a passive part over ${band.name}: the phase probably turns by more than 180° between neighbouring points${df ? ` (they are ${formatFrequency(df)} apart, so delays above 1/(2Δf) = ${trimValue(0.5e9 / df)} ns alias)` : ''}; the delay figures there are not to be trusted: measure on a finer grid`,
        });
      }
    }
    const margin = check.limit ? marginOf(check.limit, b.value) : null;
    unitResults.push({ unit: u.unit, worst: b.value, atHz: b.atHz, worstOn: b.on, margin, pass: margin === null ? null : margin >= 0 });
  }
  return resultOf(check, unitResults, units, score, part.typicalAt);
}

/**
 * A check's result from its units' results: the worst is the unit worst with
 * the least margin (ties: lowest frequency, then the first unit), typical by
 * typicalOf over `typicalUnits` (the units in the order of `unitResults`),
 * pass when every unit passes.
 */
export function resultOf(
  check: NormalizedCheck,
  unitResults: readonly UnitResult[],
  typicalUnits: readonly UnitData[],
  score: (v: number) => number,
  typicalAt: Readonly<Record<string, string>> | null,
): CheckResult {
  let worst = unitResults[0];
  for (const r of unitResults.slice(1)) {
    const a = score(r.worst),
      w = score(worst.worst);
    if (a < w || (a === w && r.atHz !== null && worst.atHz !== null && r.atHz < worst.atHz)) worst = r;
  }
  const limit = check.limit;
  return {
    kind: check.kind,
    figure: check.figure.id,
    label: check.label,
    on: check.on,
    band: check.band.name,
    fromHz: check.band.fromHz,
    toHz: check.band.toHz,
    unit: check.figure.unit,
    limit,
    assuredBy: check.assuredBy,
    worst: worst.worst,
    worstAtHz: worst.atHz,
    worstUnit: worst.unit,
    worstOn: worst.worstOn,
    ...typicalOf(unitResults, typicalUnits, score, typicalAt),
    margin: worst.margin,
    pass: limit ? unitResults.every((r) => r.pass === true) : null,
    units: unitResults,
    ...(check.change ? { change: check.change } : {}),
  };
}

/** The frequencies a check is evaluated on for a unit: the noise frequencies for noise figures (null when the file has none), else the network's. */
export function gridOf(check: NormalizedCheck, u: UnitData): Float64Array | null {
  return check.figure.grid === 'noise' ? (u.noise?.freqHz ?? null) : u.network.freqHz;
}

/**
 * Typical: rank the units by margin (by the bad direction without a limit),
 * least first; typical is the worst value of the median unit, and for an even
 * count the one of the two middle units with the smaller margin. Ranking by
 * margin rather than taking the median of the signed worsts keeps units that
 * err on opposite sides of a two-sided limit from cancelling. With
 * `typical-at`, only the units measured under those conditions are ranked
 * (when the check has such units).
 */
export function typicalOf(
  results: readonly UnitResult[],
  units: readonly UnitData[],
  score: (v: number) => number,
  at: Readonly<Record<string, string>> | null,
): { typical: number; typicalUnit: string; typicalAt: Readonly<Record<string, string>> | null; typicalMixed: boolean } {
  const matches = (u: UnitData) => at !== null && Object.entries(at).every(([k, v]) => u.conditions[k] === v);
  const restricted = at !== null && units.some(matches);
  const pool = results.map((r, i) => ({ r, i, u: units[i] })).filter((x) => !restricted || matches(x.u));
  const order = (x: number, y: number) => (x < y ? -1 : x > y ? 1 : 0);
  const ranked = pool.slice().sort((a, b) => order(score(a.r.worst), score(b.r.worst)) || a.i - b.i);
  const mid = ranked[Math.ceil(ranked.length / 2) - 1];
  const condition = (u: UnitData) => JSON.stringify(Object.entries(u.conditions).sort());
  const typicalMixed = new Set(pool.map((x) => condition(x.u))).size > 1;
  return { typical: mid.r.worst, typicalUnit: mid.r.unit, typicalAt: restricted ? at : null, typicalMixed };
}

function evaluateItem(
  check: NormalizedCheck,
  plainCtx: FigureContext,
  asWritten: Item,
  u: UnitData,
  score: (v: number) => number,
  problem: (code: SpecError['code'], message: string) => never,
  pairs: NormalizedPart['mixedModePairs'],
): { value: number; atHz: number | null; score: number; on: string; lowest: { value: number; atHz: number | null; stepHz: number | null } } {
  const fig = check.figure;
  const { network, item } = itemOnNetwork(plainCtx.network, pairs, asWritten, u.mixedModeOrder);
  const ctx: FigureContext = network === plainCtx.network ? plainCtx : { ...plainCtx, network };
  const where = `${fig.id} on ${item.label} in unit ${u.unit} (${u.file})`;
  if (fig.shape === 'scalar') {
    let v: number;
    try {
      v = (fig.scalar as NonNullable<typeof fig.scalar>)(ctx, item);
    } catch (e) {
      if (e instanceof FigureUndefined) problem('figure-undefined', `${where}: ${e.message}`);
      throw e;
    }
    return { value: v, atHz: null, score: score(v), on: item.label, lowest: { value: v, atHz: null, stepHz: null } };
  }
  let values: Float64Array;
  try {
    values = (fig.perPoint as NonNullable<typeof fig.perPoint>)(ctx, item);
  } catch (e) {
    if (e instanceof FigureUndefined) problem('figure-undefined', `${where}: ${e.message}`);
    problem('bad-expression', `${where}: ${(e as Error).message}`);
  }
  const grid = fig.grid === 'noise' && ctx.noise ? ctx.noise.freqHz : ctx.network.freqHz;
  const set = bandSet(grid, values, ctx.band.fromHz, ctx.band.toHz);
  for (let k = 0; k < set.values.length; k++) {
    if (Number.isNaN(set.values[k])) {
      const why = fig.whyUndefined
        ? `: ${fig.whyUndefined(ctx, item, set.freqHz[k])}`
        : fig.undefinedWhere
          ? `: it is not defined where ${fig.undefinedWhere}`
          : '';
      problem('figure-undefined', `${where} has no value at ${formatFrequency(set.freqHz[k])}${why}`);
    }
  }
  let lowK = 0;
  for (let k = 1; k < set.values.length; k++) if (set.values[k] < set.values[lowK]) lowK = k;
  const lowest = { value: set.values[lowK], atHz: set.freqHz[lowK], stepHz: gridStep(grid, set.freqHz[lowK]) };
  if (fig.shape === 'span') {
    let max = -Infinity;
    for (const v of set.values) if (v > max) max = v;
    const v = max - lowest.value;
    return { value: v, atHz: null, score: score(v), on: item.label, lowest };
  }
  let bestK = 0;
  let bestS = score(set.values[0]);
  for (let k = 1; k < set.values.length; k++) {
    const s = score(set.values[k]);
    if (s < bestS) {
      bestS = s;
      bestK = k;
    }
  }
  return { value: set.values[bestK], atHz: set.freqHz[bestK], score: bestS, on: item.label, lowest };
}

/** The spacing of the measured grid around f (the larger of the two neighbouring steps), or null for one point. */
function gridStep(freqHz: Float64Array, f: number): number | null {
  if (freqHz.length < 2) return null;
  let i = 0;
  while (i < freqHz.length - 2 && freqHz[i + 1] < f) i++;
  const left = freqHz[i + 1] - freqHz[i];
  const right = i + 2 < freqHz.length ? freqHz[i + 2] - freqHz[i + 1] : left;
  return Math.max(left, right);
}

const trimValue = (v: number) => String(Number(v.toPrecision(4)));
