/**
 * Fuzzing part files: the demo catalog's part files, mutated the ways people
 * and tools break YAML (a value of the wrong type, a key misspelt or dropped,
 * quotes, anchors and aliases, tags, indentation, a line lost or repeated),
 * are loaded, checked and evaluated against the demo parts' real measured
 * networks, and their plots' models are built. The property: whatever comes
 * in, the result is a value or a list of errors, each with a file, a line and
 * a message — never an exception, never a hang. Shared by the fixed-seed test
 * (test/part-file/fuzz.test.ts) and the longer bench run (npm run bench:fuzz).
 */
import { readFileSync, readdirSync } from 'node:fs';
import { join } from 'node:path';
import fc from 'fast-check';
import { evaluatePart, type UnitData } from '../../src/evaluate/evaluate.js';
import { loadExpressionCompiler, type ExpressionCompiler } from '../../src/figures/expression.js';
import { loadPartFile } from '../../src/pipeline/part.js';
import { buildPlots } from '../../src/plots/model.js';
import { loadPartText } from '../../src/part-file/load.js';

const CONTENT = join(import.meta.dirname, '../../content');

export interface Base {
  readonly name: string;
  readonly text: string;
  readonly units: readonly UnitData[];
}

/** The demo parts: their text and their units as the pipeline loads them. */
export async function demoBases(): Promise<Base[]> {
  const out: Base[] = [];
  for (const slug of readdirSync(join(CONTENT, 'parts')).sort()) {
    const file = join(CONTENT, 'parts', slug, 'part.yaml');
    const loaded = await loadPartFile(file, CONTENT, `parts/${slug}/part.yaml`);
    if (!loaded.part) throw new Error(`demo part ${slug} does not load`);
    out.push({ name: `parts/${slug}/part.yaml`, text: readFileSync(file, 'utf8'), units: loaded.units });
  }
  return out;
}

/** Replacement scalars: wrong types, edge numbers, YAML's special forms. */
const VALUES = [
  '',
  '~',
  'null',
  'true',
  'no',
  '0',
  '-1',
  '1e400',
  '-0',
  '.nan',
  '.inf',
  '0x1F',
  '1_000',
  '3 dB',
  '3 GHz',
  '-3 GHz',
  '1 Hz',
  '1e-30 Hz',
  '100000 GHz',
  '2.4GHz',
  '[]',
  '{}',
  '[1, 2]',
  '{a: 1}',
  '"quoted"',
  "'single'",
  '"unterminated',
  '"\\u0000"',
  '&anchor value',
  '*anchor',
  '*nowhere',
  '!!binary aGVsbG8=',
  '!!str 5',
  '!custom x',
  '|\n  block',
  '>-\n  folded',
  'S21',
  'S99',
  'Sdd21',
  'S0',
  'S1,',
  'U1',
  '💥',
  'a'.repeat(5000),
  '2026-02-30',
  '2026-13-01',
  '@',
  '`',
  '? complex key',
  '- item',
] as const;

const KEYS = [
  'part',
  'class',
  'bands',
  'limits',
  'measurements',
  'figure',
  'on',
  'band',
  'min',
  'max',
  'tolerance',
  'nominal',
  'unit',
  'file',
  'ports',
  'ways',
  'mixed-mode',
  'typical-at',
  'when',
  'change',
  'report',
  'custom-figures',
  'revision',
  'aperture',
  'level',
  'lot',
  'conditions',
  'assured-by',
  'plots',
] as const;

export type Mutation =
  | { kind: 'value'; line: number; value: number }
  | { kind: 'key'; line: number; key: number }
  | { kind: 'drop'; line: number }
  | { kind: 'repeat'; line: number }
  | { kind: 'indent'; line: number; by: number }
  | { kind: 'insert'; line: number; key: number; value: number }
  | { kind: 'swap'; line: number; other: number }
  | { kind: 'truncate'; at: number };

export const mutationArb: fc.Arbitrary<Mutation> = fc.oneof(
  fc.record({ kind: fc.constant('value' as const), line: fc.nat(), value: fc.nat() }),
  fc.record({ kind: fc.constant('key' as const), line: fc.nat(), key: fc.nat() }),
  fc.record({ kind: fc.constant('drop' as const), line: fc.nat() }),
  fc.record({ kind: fc.constant('repeat' as const), line: fc.nat() }),
  fc.record({ kind: fc.constant('indent' as const), line: fc.nat(), by: fc.integer({ min: -4, max: 4 }) }),
  fc.record({ kind: fc.constant('insert' as const), line: fc.nat(), key: fc.nat(), value: fc.nat() }),
  fc.record({ kind: fc.constant('swap' as const), line: fc.nat(), other: fc.nat() }),
  fc.record({ kind: fc.constant('truncate' as const), at: fc.nat() }),
);

/** One mutation applied to a part file's text. Values are swapped inside flow maps ({k: v, …}) and block mappings alike. */
export function mutate(text: string, m: Mutation): string {
  const lines = text.split('\n');
  const i = 'line' in m ? m.line % lines.length : 0;
  const line = lines[i];
  switch (m.kind) {
    case 'value': {
      // the n-th "key: value" on the line gets another value
      const spots = [...line.matchAll(/(:\s+)([^,{}\n]+?)(?=\s*[,}]|\s*$)/g)];
      if (!spots.length) return text;
      const s = spots[m.value % spots.length];
      const v = VALUES[m.value % VALUES.length];
      lines[i] = line.slice(0, (s.index ?? 0) + s[1].length) + v + line.slice((s.index ?? 0) + s[0].length);
      break;
    }
    case 'key': {
      const spots = [...line.matchAll(/([A-Za-z][\w-]*)(?=:\s)/g)];
      if (!spots.length) return text;
      const s = spots[m.key % spots.length];
      lines[i] = line.slice(0, s.index) + KEYS[m.key % KEYS.length] + line.slice((s.index ?? 0) + s[0].length);
      break;
    }
    case 'drop':
      lines.splice(i, 1);
      break;
    case 'repeat':
      lines.splice(i, 0, line);
      break;
    case 'indent':
      lines[i] = m.by >= 0 ? ' '.repeat(m.by) + line : line.replace(new RegExp(`^ {0,${-m.by}}`), '');
      break;
    case 'insert':
      lines.splice(i, 0, `${line.match(/^\s*(- )?/)?.[0].replace('-', ' ') ?? ''}${KEYS[m.key % KEYS.length]}: ${VALUES[m.value % VALUES.length]}`);
      break;
    case 'swap': {
      const j = m.other % lines.length;
      [lines[i], lines[j]] = [lines[j], lines[i]];
      break;
    }
    case 'truncate':
      return text.slice(0, m.at % (text.length + 1));
  }
  return lines.join('\n');
}

let compiler: Promise<ExpressionCompiler> | null = null;

/**
 * What the property checks: loading, evaluating and building the plot models of the mutated text
 * either succeed or return errors that each name a file, a line ≥ 0 and say something; anything
 * thrown is a bug. The units are the base part's, matched by position.
 */
export async function survives(base: Base, text: string): Promise<'evaluated' | 'refused'> {
  const compile = await (compiler ??= loadExpressionCompiler());
  const loaded = loadPartText(text, base.name, compile);
  const positioned = (errors: ReadonlyArray<{ file: string; line: number; column: number; message: string }>) => {
    for (const e of errors) {
      if (!e.file || !(e.line >= 0) || !(e.column >= 0) || !e.message) throw new Error(`an error without its position or message: ${JSON.stringify(e)}`);
    }
  };
  positioned(loaded.errors);
  if (!loaded.value) {
    if (!loaded.errors.length) throw new Error('no value and no error');
    return 'refused';
  }
  const part = loaded.value;
  const units = part.measurements.map((m, k) => {
    const u = base.units[k % base.units.length];
    return { ...u, unit: m.label, serial: m.unit, file: m.file, conditions: m.conditions, fileAt: m.fileAt };
  });
  const r = evaluatePart(part, units);
  positioned(r.errors);
  if (!r.value) return 'refused';
  buildPlots(part, units);
  return 'evaluated';
}
