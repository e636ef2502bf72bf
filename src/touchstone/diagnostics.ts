/**
 * Errors and warnings of the Touchstone reader, as data: a code from a closed
 * set, a 1-based line (0 when the problem is the file as a whole), an optional
 * 1-based column, and a message that says what was wrong and what was expected.
 */
import { printable } from '../format/escape.js';
import { whereOf } from '../format/where.js';

export type TouchstoneErrorCode =
  | 'not-text'
  | 'bad-number'
  | 'number-range'
  | 'value-count'
  | 'frequency-order'
  | 'duplicate-frequency'
  | 'missing-option-line'
  | 'unknown-option'
  | 'option-value'
  | 'negative-magnitude'
  | 'unknown-keyword'
  | 'keyword-value'
  | 'keyword-order'
  | 'missing-keyword'
  | 'frequency-count'
  | 'noise-count'
  | 'noise-data'
  | 'port-count'
  | 'parameter-ports'
  | 'version'
  | 'no-data';

export type TouchstoneWarningCode =
  | 'later-option-line'
  | 'comment-impedance'
  | 'extension-mismatch'
  | 'ignored-keyword'
  | 'missing-two-port-order'
  | 'missing-end'
  | 'missing-noise-data'
  | 'cr-line-ends';

export interface TouchstoneDiagnostic<Code extends string = TouchstoneErrorCode | TouchstoneWarningCode> {
  readonly code: Code;
  readonly message: string;
  readonly line: number;
  readonly column?: number;
}

export type TouchstoneError = TouchstoneDiagnostic<TouchstoneErrorCode>;
export type TouchstoneWarning = TouchstoneDiagnostic<TouchstoneWarningCode>;

/** `FILE:LINE: message` (or `FILE:LINE:COL: message`; `FILE: message` for whole-file problems). */
export function formatDiagnostic(fileName: string, d: TouchstoneDiagnostic, severity?: 'error' | 'warning'): string {
  return `${printable(whereOf(fileName, d.line, d.column))}: ${severity ? `${severity}: ` : ''}${printable(d.message)}`;
}

/** Thrown inside the parser to stop at the first error; never escapes it. */
export class StopParsing extends Error {
  constructor(readonly diagnostic: TouchstoneError) {
    super(diagnostic.message);
  }
}

export function fail(code: TouchstoneErrorCode, line: number, message: string, column?: number): never {
  throw new StopParsing(column ? { code, line, message, column } : { code, line, message });
}
