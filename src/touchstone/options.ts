/**
 * The option line: `# [unit] [parameter] [format] [R value…]`. Tokens may come
 * in any order and in any case; each is classified by what it is. Absent
 * tokens take the standard's defaults: GHz, S, MA, R 50.
 */
import { fail } from './diagnostics.js';
import type { DataFormat, FrequencyUnit, OptionLine, Parameter } from './types.js';

const UNITS: Record<string, FrequencyUnit> = { HZ: 'Hz', KHZ: 'kHz', MHZ: 'MHz', GHZ: 'GHz' };
const PARAMETERS = new Set(['S', 'Y', 'Z', 'H', 'G']);
const FORMATS = new Set(['DB', 'MA', 'RI']);

export interface Token {
  readonly text: string;
  readonly column: number;
}

/** Splits text on blanks and tabs, keeping 1-based columns. */
export function tokenize(text: string, firstColumn = 1): Token[] {
  const out: Token[] = [];
  const re = /[^\s]+/g;
  let m: RegExpExecArray | null;
  while ((m = re.exec(text))) out.push({ text: m[0], column: firstColumn + m.index });
  return out;
}

/** `text` is what follows the '#', comment removed; `column` is where it starts. */
export function parseOptionLine(text: string, line: number, column: number): OptionLine {
  let unit: FrequencyUnit | undefined;
  let parameter: Parameter | undefined;
  let format: DataFormat | undefined;
  let resistance: number[] | undefined;
  const tokens = tokenize(text, column);
  for (let i = 0; i < tokens.length; i++) {
    const t = tokens[i];
    const up = t.text.toUpperCase();
    const twice = (what: string) => fail('option-value', line, `the option line gives a ${what} twice ("${t.text}"); expected one`, t.column);
    if (up in UNITS) {
      if (unit) twice('frequency unit');
      unit = UNITS[up];
    } else if (PARAMETERS.has(up)) {
      if (parameter) twice('parameter');
      parameter = up as Parameter;
    } else if (FORMATS.has(up)) {
      if (format) twice('format');
      format = up as DataFormat;
    } else if (up === 'R') {
      if (resistance) twice('reference resistance');
      resistance = [];
      while (i + 1 < tokens.length && /^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/.test(tokens[i + 1].text)) {
        const v = Number(tokens[++i].text);
        if (!(v > 0) || !Number.isFinite(v)) {
          fail('option-value', line, `reference resistance ${tokens[i].text} must be a positive number of ohms`, tokens[i].column);
        }
        resistance.push(v);
      }
      if (resistance.length === 0 && tokens[i + 1]?.text.startsWith('(')) {
        fail(
          'option-value',
          line,
          `R ${tokens[i + 1].text} is a complex reference impedance, which Touchstone does not have; expected a positive real number of ohms (e.g. "R 50")`,
          tokens[i + 1].column,
        );
      }
      if (resistance.length === 0)
        fail('option-value', line, 'R on the option line must be followed by the reference resistance in ohms (e.g. "R 50")', t.column);
    } else {
      const hint = /^R\d/i.test(t.text) ? ` (write "R ${t.text.slice(1)}" with a space)` : '';
      fail(
        'unknown-option',
        line,
        `unknown option "${t.text}" on the option line${hint}; expected a frequency unit (Hz, kHz, MHz, GHz), a parameter (S, Y, Z, H, G), a format (DB, MA, RI) or R followed by the reference resistance`,
        t.column,
      );
    }
  }
  return { frequencyUnit: unit ?? 'GHz', parameter: parameter ?? 'S', format: format ?? 'MA', resistance: resistance ?? [], line };
}
