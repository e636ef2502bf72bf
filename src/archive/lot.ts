/**
 * Lot statistics of one limit across its units: count, mean, sample standard
 * deviation (n − 1 in the denominator, numpy's ddof=1), minimum and maximum
 * of the unit worsts, and the process capability Cpk against the limit —
 * one-sided for max, (USL − mean)/(3s); for min, (mean − LSL)/(3s); for
 * nominal ± tolerance, the smaller of the two (the usual definitions, e.g.
 * Montgomery, Introduction to Statistical Quality Control, from memory).
 *
 * Cpk is given only from CPK_MIN_UNITS units up: with few units the standard
 * deviation is too uncertain for it to mean anything — from 5 units the 95 %
 * confidence interval of s runs from about 0.6 to 2.9 times the true σ, so a
 * "Cpk of 1.33" could be anything from 0.5 to 2.2; at 10 units it is still
 * 0.7 to 1.8. Groups by lot (a measurement's `lot`) and by condition follow
 * the same rules. Values only.
 */
import type { CheckResult } from '../evaluate/evaluate.js';

export const CPK_MIN_UNITS = 10;

export interface LotSummary {
  readonly count: number;
  readonly mean: number;
  /** Sample standard deviation (n − 1); null for one value. */
  readonly std: number | null;
  readonly min: number;
  readonly max: number;
  /** null: fewer than CPK_MIN_UNITS values, no limit, or no spread (then cpkNote says which). */
  readonly cpk: number | null;
  readonly cpkNote: string;
}

export function summarize(values: readonly number[], limit: CheckResult['limit']): LotSummary {
  const n = values.length;
  let sum = 0,
    min = Infinity,
    max = -Infinity;
  for (const v of values) {
    sum += v;
    if (v < min) min = v;
    if (v > max) max = v;
  }
  const mean = sum / n;
  let ss = 0;
  for (const v of values) ss += (v - mean) * (v - mean);
  const std = n > 1 ? Math.sqrt(ss / (n - 1)) : null;
  let cpk: number | null = null;
  let cpkNote = '';
  if (!limit) cpkNote = 'no limit';
  else if (n < CPK_MIN_UNITS) cpkNote = `fewer than ${CPK_MIN_UNITS} units`;
  else if (!std || !Number.isFinite(mean)) cpkNote = 'no spread';
  else cpk = cpkOf(mean, std, limit);
  return { count: n, mean, std, min, max, cpk, cpkNote };
}

/** Cpk of a mean and standard deviation against a limit (see above). */
export function cpkOf(mean: number, std: number, limit: NonNullable<CheckResult['limit']>): number {
  if (limit.nominal !== undefined && limit.tolerance !== undefined) {
    return Math.min(limit.nominal + limit.tolerance - mean, mean - (limit.nominal - limit.tolerance)) / (3 * std);
  }
  const sides: number[] = [];
  if (limit.max !== undefined) sides.push((limit.max - mean) / (3 * std));
  if (limit.min !== undefined) sides.push((mean - limit.min) / (3 * std));
  return Math.min(...sides);
}

export interface LotGroup {
  /** "lot L2417", "25 °C", or '' for all units. */
  readonly label: string;
  readonly summary: LotSummary;
  /** The group's worst value (least margin) — per condition, a corner's worst. */
  readonly worst: number;
}

/**
 * A limit's statistics: over all its units, then per lot (when units carry
 * lots) and per condition (when they were measured under several), with the
 * spread of the condition groups' worsts (the largest minus the smallest).
 * Over all units and per lot a unit counts once, with its worst over its
 * measurements; per condition, each measurement under it.
 */
export function lotStatistics(
  r: CheckResult,
  info: (unit: string) => { serial: string; lot: string | null; conditions: Readonly<Record<string, string>> },
): { all: LotGroup; allWorsts: number[]; lots: LotGroup[]; conditions: LotGroup[]; conditionSpread: number | null } {
  const byMargin = (units: CheckResult['units']) => units.reduce((w, u) => ((u.margin ?? 0) < (w.margin ?? 0) ? u : w), units[0]);
  const group = (label: string, units: CheckResult['units']): LotGroup => ({
    label,
    summary: summarize(
      units.map((u) => u.worst),
      r.limit,
    ),
    worst: (r.limit ? byMargin(units) : units[0]).worst,
  });
  const split = (key: (u: CheckResult['units'][number]) => string | null) => {
    const m = new Map<string, CheckResult['units'][number][]>();
    for (const u of r.units) {
      const k = key(u);
      if (k === null) continue;
      m.set(k, [...(m.get(k) ?? []), u]);
    }
    return m;
  };
  const lots = new Map([...split((u) => info(u.unit).lot)].map(([k, us]) => [k, [...new Map(us.map((u) => [info(u.unit).serial, u])).values()]]));
  const conds = split((u) => Object.values(info(u.unit).conditions).join(', '));
  const conditions = conds.size > 1 ? [...conds].map(([k, us]) => group(k, us)) : [];
  const worsts = conditions.map((g) => g.worst);
  // over the lot, a unit counts once: its worst over its measurements (a unit at three temperatures is one unit)
  const perSerial = [...split((u) => info(u.unit).serial).values()].map((us) => (r.limit ? byMargin(us) : us[0]));
  return {
    all: group('', perSerial),
    allWorsts: perSerial.map((u) => u.worst),
    lots: lots.size ? [...lots].map(([k, us]) => group(`lot ${k}`, us)) : [],
    conditions,
    conditionSpread: worsts.length > 1 ? Math.max(...worsts) - Math.min(...worsts) : null,
  };
}

/** A strip of the unit worsts against the limit, as a small SVG (numbers only in it): a tick per unit, the limit in red. */
export function stripSvg(values: readonly number[], limit: CheckResult['limit'], scale = 1): string {
  const lines: number[] = [];
  if (limit) {
    if (limit.nominal !== undefined && limit.tolerance !== undefined) lines.push(limit.nominal - limit.tolerance, limit.nominal + limit.tolerance);
    if (limit.max !== undefined) lines.push(limit.max);
    if (limit.min !== undefined) lines.push(limit.min);
  }
  const xs = [...values, ...lines].map((v) => v * scale).filter(Number.isFinite);
  if (!xs.length) return '';
  let lo = Math.min(...xs),
    hi = Math.max(...xs);
  const pad = (hi - lo) * 0.08 || Math.abs(hi) * 0.05 || 1;
  lo -= pad;
  hi += pad;
  const W = 200,
    H = 22;
  const x = (v: number) => (((v * scale - lo) / (hi - lo)) * W).toFixed(1);
  const ticks = values
    .filter(Number.isFinite)
    .map((v) => `<line x1="${x(v)}" x2="${x(v)}" y1="5" y2="17" stroke="#1f4e8c" stroke-width="1.6" stroke-opacity="0.8"/>`)
    .join('');
  const limits = lines
    .filter(Number.isFinite)
    .map((v) => `<line x1="${x(v)}" x2="${x(v)}" y1="1" y2="21" stroke="#c0392b" stroke-width="1.4" stroke-dasharray="3 2"/>`)
    .join('');
  return `<svg class="strip" width="${W}" height="${H}" viewBox="0 0 ${W} ${H}" role="img" aria-label="${values.length} unit worsts (blue ticks) against the limit (red dashes)"><line x1="0" x2="${W}" y1="11" y2="11" stroke="#c8ccd2"/>${limits}${ticks}</svg>`;
}
