/**
 * One call from text or bytes to a network: parse, then normalize. Errors
 * and warnings come back as data, never as exceptions.
 */
import type { TouchstoneError, TouchstoneWarning } from './diagnostics.js';
import { toNetwork, type TouchstoneData } from './normalize.js';
import { parseTouchstone, type ParseOptions, type ParseResult } from './parse.js';

export interface ReadResult {
  readonly value: TouchstoneData | null;
  readonly errors: readonly TouchstoneError[];
  readonly warnings: readonly TouchstoneWarning[];
}

export function fromParsed(parsed: ParseResult): ReadResult {
  if (!parsed.record) return { value: null, errors: parsed.errors, warnings: parsed.warnings };
  return { value: toNetwork(parsed.record, true), errors: [], warnings: parsed.warnings };
}

export function readTouchstone(input: string | Uint8Array, options: ParseOptions = {}): ReadResult {
  return fromParsed(parseTouchstone(input, options));
}
