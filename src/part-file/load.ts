/**
 * Part file text → NormalizedPart, in stages: YAML 1.2 parse (so that `on`
 * stays a key, not the boolean YAML 1.1 makes of it) → schema check
 * (validate.ts) → normalization (normalize.ts). All errors of a file come back
 * at once, each with its line and column.
 */
import { LineCounter, parseDocument, type Document } from 'yaml';
import type { ExpressionCompiler } from '../figures/expression.js';
import type { SpecError } from './diagnostics.js';
import { normalizePart, type NormalizedPart } from './normalize.js';
import { PART_SCHEMA } from './part-schema.js';
import { validate } from './validate.js';

export interface LoadResult {
  readonly value: NormalizedPart | null;
  readonly errors: readonly SpecError[];
  /** The part declares custom figures and no compiler was given: load one and load the text again. */
  readonly needsCompiler?: true;
}

/** YAML 1.2 text → its document and line index, or the syntax errors (each positioned). */
export function parseYaml(text: string, file: string): { doc: Document.Parsed; lines: LineCounter; errors: SpecError[] } {
  const lines = new LineCounter();
  const doc = parseDocument(text, { version: '1.2', lineCounter: lines, prettyErrors: false, uniqueKeys: true });
  const errors = doc.errors.map((e): SpecError => {
    const p = e.linePos?.[0] ?? lines.linePos(e.pos[0]);
    const message =
      e.code === 'DUPLICATE_KEY' ? 'a key is given twice in the same mapping; give each key once' : `YAML syntax: ${e.message.split(' at line')[0]}`;
    return { code: 'yaml-syntax', file, message, line: p.line, column: p.col };
  });
  return { doc, lines, errors };
}

export function loadPartText(text: string, file: string, compile?: ExpressionCompiler): LoadResult {
  const { doc, lines, errors: syntax } = parseYaml(text, file);
  if (syntax.length) return { value: null, errors: syntax };
  if (doc.contents === null) {
    return {
      value: null,
      errors: [{ code: 'missing-key', file, message: 'the part file is empty; it needs at least part, class and measurements', line: 0, column: 0 }],
    };
  }
  const checked = validate(doc.contents, PART_SCHEMA, file, lines, (a) => a.resolve(doc));
  const normalized = normalizePart({ file, value: checked.value, positions: checked.positions, compile });
  if (normalized.needsCompiler && checked.errors.length === 0) return { value: null, errors: [], needsCompiler: true };
  const errors = [...checked.errors, ...normalized.errors].sort((a, b) => a.line - b.line || a.column - b.column);
  return { value: errors.length ? null : normalized.value, errors };
}
