/** Human formatting of frequencies and values, shared by the CLI and the pages. */

const FREQ_UNITS = [
  [1e9, 'GHz'],
  [1e6, 'MHz'],
  [1e3, 'kHz'],
  [1, 'Hz'],
] as const;

/** The unit that suits a frequency (or the top of a range). */
export function frequencyUnitFor(hz: number): { scale: number; unit: string } {
  for (const [scale, unit] of FREQ_UNITS) if (Math.abs(hz) >= scale) return { scale, unit };
  return { scale: 1, unit: 'Hz' };
}

/** "2.45 GHz": up to `digits` significant digits, trailing zeros dropped. */
export function formatFrequency(hz: number, digits = 6): string {
  if (!Number.isFinite(hz)) return String(hz);
  const { scale, unit } = frequencyUnitFor(hz);
  return `${trimNumber(hz / scale, digits)} ${unit}`;
}

/**
 * The display resolution a measured grid supports: the decade below its step
 * (a 5 MHz grid → 1 MHz, a 10 MHz grid → 10 MHz, a 250 kHz grid → 100 kHz).
 * Frequency figures are shown to it, so that no interpolated band edge claims
 * more digits than the measurement has; their exact values stay in the JSON.
 */
export function gridResolutionHz(freqHz: ArrayLike<number>): number | null {
  if (freqHz.length < 2) return null;
  const steps: number[] = [];
  for (let k = 1; k < freqHz.length; k++) steps.push(freqHz[k] - freqHz[k - 1]);
  steps.sort((a, b) => a - b);
  const median = steps[steps.length >> 1];
  return median > 0 ? Math.pow(10, Math.floor(Math.log10(median) + 1e-9)) : null;
}

/** The resolution frequency figures of several measured grids are shown to: the coarsest of theirs, or null. */
export function coarsestResolutionHz(grids: ReadonlyArray<ArrayLike<number>>): number | null {
  let out: number | null = null;
  for (const g of grids) {
    const r = gridResolutionHz(g);
    if (r !== null && (out === null || r > out)) out = r;
  }
  return out;
}

/** A frequency rounded to a resolution: "136 MHz" for 135.8415 MHz on a 1 MHz resolution. */
export function formatFrequencyTo(hz: number, resolutionHz: number | null): string {
  if (!Number.isFinite(hz) || !resolutionHz) return formatFrequency(hz, 7);
  return formatFrequency(Math.round(hz / resolutionHz) * resolutionHz, 12);
}

/** A number to `digits` significant digits without trailing zeros or exponent for ordinary sizes. */
export function trimNumber(v: number, digits = 6): string {
  if (!Number.isFinite(v)) return v > 0 ? '∞' : v < 0 ? '−∞' : 'n/a';
  if (v === 0) return '0';
  const a = Math.abs(v);
  if (a >= 1e-4 && a < 1e9) return String(Number(v.toPrecision(digits)));
  return v.toExponential(digits - 1).replace(/\.?0+e/, 'e');
}

/** Fixed decimals, with a true minus sign for negative values. */
export function fixed(v: number, decimals: number): string {
  if (!Number.isFinite(v)) return trimNumber(v);
  const s = v.toFixed(decimals);
  return s.startsWith('-') ? (Number(s) === 0 ? s.slice(1) : `−${s.slice(1)}`) : s;
}

/** A band as text: "2.4 GHz to 2.5 GHz", or one frequency. */
export function bandRange(fromHz: number, toHz: number): string {
  return fromHz === toHz ? formatFrequency(fromHz) : `${formatFrequency(fromHz)} to ${formatFrequency(toHz)}`;
}
