/**
 * Quantities as part files write them: "2.45 GHz", "1.2 dB", "4.78 ns",
 * "90 deg", or a bare number for unitless values (VSWR, stability factors).
 * Parsed to the base unit of their kind: Hz, dB, degrees, seconds.
 */

export type QuantityKind = 'frequency' | 'dB' | 'deg' | 'time' | 'unitless';

interface UnitInfo {
  readonly kind: QuantityKind;
  /** The unit is 10^exp of the base unit. */
  readonly exp: number;
}

/** Unit spellings, matched case-sensitively except where the trade writes them either way. */
const UNITS: Record<string, UnitInfo> = {
  Hz: { kind: 'frequency', exp: 0 },
  kHz: { kind: 'frequency', exp: 3 },
  MHz: { kind: 'frequency', exp: 6 },
  GHz: { kind: 'frequency', exp: 9 },
  dB: { kind: 'dB', exp: 0 },
  deg: { kind: 'deg', exp: 0 },
  '°': { kind: 'deg', exp: 0 },
  s: { kind: 'time', exp: 0 },
  ms: { kind: 'time', exp: -3 },
  us: { kind: 'time', exp: -6 },
  µs: { kind: 'time', exp: -6 },
  ns: { kind: 'time', exp: -9 },
  ps: { kind: 'time', exp: -12 },
};

const CASE_FOLD: Record<string, string> = { hz: 'Hz', khz: 'kHz', mhz: 'MHz', ghz: 'GHz', db: 'dB', deg: 'deg' };

export const KIND_NAMES: Record<QuantityKind, string> = {
  frequency: 'a frequency (Hz, kHz, MHz, GHz)',
  dB: 'a level in dB',
  deg: 'an angle in deg',
  time: 'a time (s, ms, us, ns, ps)',
  unitless: 'a plain number (no unit)',
};

export type QuantityResult =
  | { readonly ok: true; readonly value: number; readonly kind: QuantityKind; readonly unit: string }
  | { readonly ok: false; readonly problem: 'not-a-quantity' | 'unknown-unit'; readonly message: string };

const NUMBER = /^([+\-−]?(?:\d+\.?\d*|\.\d+))(?:[eE]([+\-]?\d+))?\s*(.*)$/;

/** Parses a number with an optional unit; a bare number is unitless. */
export function parseQuantity(input: string | number): QuantityResult {
  if (typeof input === 'number') {
    return Number.isFinite(input)
      ? { ok: true, value: input, kind: 'unitless', unit: '' }
      : { ok: false, problem: 'not-a-quantity', message: `${input} is not a finite number` };
  }
  const text = input.trim();
  const m = NUMBER.exec(text);
  if (!m) return { ok: false, problem: 'not-a-quantity', message: `"${input}" is not a number with a unit (such as 2.45 GHz, 1.2 dB, 4.78 ns)` };
  const mantissa = m[1].replace('−', '-');
  const exponent = Number(m[2] ?? 0);
  const unitText = m[3].trim();
  if (unitText === '') return finite(Number(`${mantissa}e${exponent}`), 'unitless', '', input);
  const unit = UNITS[unitText] ? unitText : CASE_FOLD[unitText.toLowerCase()];
  const info = unit ? UNITS[unit] : undefined;
  if (!info) {
    return {
      ok: false,
      problem: 'unknown-unit',
      message: `unknown unit "${unitText}" in "${input}"; expected one of Hz, kHz, MHz, GHz, dB, deg, s, ms, us, ns, ps`,
    };
  }
  // the unit's power of ten joins the exponent, so "4.78 ns" is exactly the double nearest 4.78e-9
  return finite(Number(`${mantissa}e${exponent + info.exp}`), info.kind, unit as string, input);
}

/** Numbers beyond the double range (1e400) become ±Infinity when parsed: they are refused, not published as null. */
function finite(value: number, kind: QuantityKind, unit: string, input: string): QuantityResult {
  if (!Number.isFinite(value)) return { ok: false, problem: 'not-a-quantity', message: `"${input}" is beyond the range of numbers (about ±1.8e308)` };
  return { ok: true, value, kind, unit };
}
