/**
 * Errors of part files and of their evaluation, as data: a code from a closed
 * set, the file, a 1-based line and column (0 when the file as a whole is
 * meant), and a message saying what was wrong and what was expected.
 */
import { printable } from '../format/escape.js';
import { whereOf } from '../format/where.js';

export type SpecErrorCode =
  | 'yaml-syntax'
  | 'unknown-key'
  | 'missing-key'
  | 'wrong-type'
  | 'bad-value'
  | 'unknown-class'
  | 'unknown-figure'
  | 'unknown-band'
  | 'unknown-condition'
  | 'bare-frequency'
  | 'missing-unit'
  | 'unit-mismatch'
  | 'bad-parameter'
  | 'port-range'
  | 'port-count-mismatch'
  | 'path-outside'
  | 'missing-file'
  | 'touchstone'
  | 'band-outside-data'
  | 'empty-band'
  | 'bad-limit'
  | 'bad-expression'
  | 'figure-undefined'
  | 'duplicate'
  | 'bad-encoding';

export interface Position {
  readonly line: number;
  readonly column: number;
}

export interface SpecError extends Position {
  readonly code: SpecErrorCode;
  readonly file: string;
  readonly message: string;
}

/**
 * Warnings: the part evaluated, but a figure or a file says something the
 * reader of a datasheet must know (a negative excess loss on a passive part,
 * an aliased group delay, a reader's warning about a measurement file).
 */
export type SpecWarningCode = 'negative-excess-loss' | 'delay-aliased' | 'touchstone';

export interface SpecWarning extends Position {
  readonly code: SpecWarningCode;
  readonly file: string;
  readonly message: string;
}

/** `FILE:LINE:COL: error: message` (or `warning:`), then the source line and a caret under the fault when the text is known. */
export function formatSpecError(e: SpecError | SpecWarning, source?: string, severity: 'error' | 'warning' = 'error'): string {
  let out = `${printable(whereOf(e.file, e.line, e.column))}: ${severity}: ${printable(e.message)}`;
  if (source && e.line > 0) {
    const text = source.split(/\r?\n/)[e.line - 1];
    if (text !== undefined) out += `\n  ${printable(text)}\n  ${' '.repeat(Math.max(0, e.column - 1))}^`;
  }
  return out;
}
