/** Figure values and limits as people read them in tables. */

import type { Limit } from '../part-file/normalize.js';
import { fixed, formatFrequencyTo } from './units.js';

/**
 * A value in its figure's unit, by one precision policy: dB and degrees to
 * 0.01, unitless values (VSWR, K, μ) to 0.001, times to 0.001 ns (0.01 ps
 * below 1 ns), frequencies to the resolution of the measured grid when it is
 * given (gridResolutionHz), else 7 significant digits.
 */
export function formatValue(v: number | null, unit: string, resolutionHz: number | null = null): string {
  if (v === null) return '—';
  if (!Number.isFinite(v)) return v > 0 ? '∞' : v < 0 ? '−∞' : 'n/a';
  switch (unit) {
    case 'dB':
      return `${fixed(v, 2)} dB`;
    case 'deg':
      return `${fixed(v, 2)}°`;
    case 's':
      return formatTime(v);
    case 'Hz':
      return formatFrequencyTo(v, resolutionHz);
    default:
      return fixed(v, 3);
  }
}

export function formatTime(s: number): string {
  const a = Math.abs(s);
  if (a >= 1e-3) return `${fixed(s * 1e3, 3)} ms`;
  if (a >= 1e-6) return `${fixed(s * 1e6, 3)} µs`;
  if (a >= 1e-9 || a === 0) return `${fixed(s * 1e9, 3)} ns`;
  return `${fixed(s * 1e12, 2)} ps`;
}

/** "≤ 1.20 dB", "≥ 18.00 dB", "20.00 dB ± 1.00 dB", "0.50 dB to 2.00 dB". */
export function formatLimit(limit: Limit | null, unit: string): string {
  if (!limit) return '—';
  if (limit.tolerance !== undefined) return `${formatValue(limit.nominal ?? 0, unit)} ± ${formatValue(limit.tolerance, unit).replace(/^−/, '')}`;
  if (limit.max !== undefined && limit.min !== undefined) return `${formatValue(limit.min, unit)} to ${formatValue(limit.max, unit)}`;
  if (limit.max !== undefined) return `≤ ${formatValue(limit.max, unit)}`;
  if (limit.min !== undefined) return `≥ ${formatValue(limit.min, unit)}`;
  return '—';
}

/** The display unit of a row of values of one figure: ns or ps for times (by the largest), else the figure's own. */
export function displayUnit(values: ReadonlyArray<number | null>, unit: string): { label: string; scale: number } {
  if (unit === 's') {
    const m = Math.max(0, ...values.filter((v): v is number => v !== null && Number.isFinite(v)).map(Math.abs));
    return m >= 1e-9 || m === 0 ? { label: 'ns', scale: 1e9 } : { label: 'ps', scale: 1e12 };
  }
  if (unit === 'Hz') return { label: 'MHz', scale: 1e-6 };
  return { label: unit === 'deg' ? '°' : unit, scale: 1 };
}

/** A number in a display unit, without the unit: "1.31", "4.780". */
export function formatNumber(v: number | null, unit: string, d: { scale: number }, resolutionHz: number | null = null): string {
  if (v === null) return '';
  if (!Number.isFinite(v)) return v > 0 ? '∞' : '−∞';
  if (unit === 'Hz' && resolutionHz) {
    const step = resolutionHz * d.scale;
    return fixed(Math.round((v * d.scale) / step) * step, Math.max(0, Math.round(-Math.log10(step))));
  }
  const decimals = unit === 'dB' || unit === 'deg' || (unit === 's' && d.scale === 1e12) ? 2 : 3;
  return fixed(v * d.scale, decimals);
}

export interface Cell {
  readonly text: string;
  /** The exact number behind the text (null where there is none). */
  readonly value: number | null;
}

/** A change limit's stages as "initial → after thermal cycling" (each stage's condition values). */
export function formatStages(change: { readonly from: Readonly<Record<string, string>>; readonly to: Readonly<Record<string, string>> }): string {
  const one = (c: Readonly<Record<string, string>>) => Object.values(c).join(', ');
  return `${one(change.from)} → ${one(change.to)}`;
}
