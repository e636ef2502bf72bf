/**
 * What every part of the normalization shares: the file, the positions the
 * validator recorded by path, and the one list errors are collected in.
 */
import type { Position, SpecError, SpecErrorCode } from './diagnostics.js';
import type { Plain } from './validate.js';

export type Obj = Record<string, Plain>;
export const isObj = (v: Plain | undefined): v is Obj => typeof v === 'object' && v !== null && !Array.isArray(v);
export const str = (v: Plain | undefined): string | null => (typeof v === 'string' ? v : typeof v === 'number' ? String(v) : null);

export function conditionText(v: Plain): string {
  return String(v).trim().replace(/\s+/g, ' ');
}

export interface Context {
  readonly file: string;
  readonly positions: ReadonlyMap<string, Position>;
  readonly errors: SpecError[];
  /** The position of a path ("limits.0.band"), or line 0. */
  at(path: string): Position;
  err(code: SpecErrorCode, path: string, message: string): void;
}

export function contextOf(file: string, positions: ReadonlyMap<string, Position>): Context {
  const errors: SpecError[] = [];
  const at = (path: string): Position => positions.get(path) ?? { line: 0, column: 0 };
  return { file, positions, errors, at, err: (code, path, message) => errors.push({ code, file, message, ...at(path) }) };
}
