/**
 * Checks a parsed YAML document against a schema (schema-dsl.ts) and returns
 * the value as written (plain JSON values) with every error at once, each at
 * the line and column of its node, plus an index of positions by path
 * ("limits.2.band") for the checks that come after.
 */
import { isAlias, isMap, isPair, isScalar, isSeq, type Alias, type LineCounter, type Node, type Pair } from 'yaml';
import { nearest } from '../format/suggest.js';
import type { Position, SpecError, SpecErrorCode } from './diagnostics.js';
import { parseQuantity, KIND_NAMES } from './quantity.js';
import { NAME_PATTERN, type Schema } from './schema-dsl.js';

/** Alias uses walked at the most: a few are handy (a shared conditions map), thousands are an expansion bomb. */
export const MAX_ALIASES = 1000;

/** Whether a YYYY-MM-DD text names a real day (2026-02-30 and 2026-13-45 do not). */
export function isCalendarDate(text: string): boolean {
  const m = /^(\d{4})-(\d{2})-(\d{2})$/.exec(text);
  if (!m) return false;
  const [y, mo, d] = [Number(m[1]), Number(m[2]), Number(m[3])];
  const t = new Date(Date.UTC(y, mo - 1, d));
  return t.getUTCFullYear() === y && t.getUTCMonth() === mo - 1 && t.getUTCDate() === d;
}

export type Plain = string | number | boolean | null | Plain[] | { [k: string]: Plain };

export interface Validated {
  readonly value: Plain;
  readonly errors: SpecError[];
  /** Position of each path's value ("" is the document); keys get "path#key". */
  readonly positions: Map<string, Position>;
}

const describe = (s: Schema): string => {
  switch (s.t) {
    case 'string':
      return s.enum ? `one of ${s.enum.join(', ')}` : 'text';
    case 'text':
      return 'text';
    case 'integer':
      return 'a whole number';
    case 'quantity':
      return s.kinds ? s.kinds.map((k) => KIND_NAMES[k]).join(' or ') : 'a number with its unit';
    case 'scalar':
      return 'a value';
    case 'boolean':
      return 'true or false';
    case 'object':
    case 'map':
      return 'a mapping (key: value)';
    case 'array':
      return 'a list';
    case 'oneOrMany':
      return `${describe(s.items)} or a list of them`;
  }
};

export function validate(
  root: Node | null,
  schema: Schema,
  file: string,
  lines: LineCounter,
  resolveAlias?: (alias: Alias) => Node | undefined,
  rootLabel = 'the part file',
): Validated {
  const errors: SpecError[] = [];
  const positions = new Map<string, Position>();
  const posOf = (node: Node | null | undefined): Position => {
    const offset = node?.range?.[0];
    if (offset === undefined) return { line: 0, column: 0 };
    const p = lines.linePos(offset);
    return { line: p.line, column: p.col };
  };
  const err = (code: SpecErrorCode, node: Node | null | undefined, message: string) => errors.push({ code, file, message, ...posOf(node) });

  let aliases = 0;
  function walk(written: Node | null, s: Schema, path: string, label: string): Plain | undefined {
    let node = written;
    if (node && isAlias(node)) {
      // an alias stands for its anchored node; each use is walked again, so uses are counted against expansion bombs
      if (++aliases > MAX_ALIASES) {
        if (aliases === MAX_ALIASES + 1)
          err('bad-value', node, `more than ${MAX_ALIASES} alias uses (*name); a part file needs few, and this many is how a file expands without bound`);
        return undefined;
      }
      const target = resolveAlias ? resolveAlias(node) : undefined;
      if (!target) {
        err('bad-value', node, `alias *${node.source} names no anchor (&${node.source}) defined before it`);
        return undefined;
      }
      node = target;
    }
    positions.set(path, posOf(written));
    const wrong = () => {
      err(
        'wrong-type',
        node,
        `${label} must be ${describe(s)}${node && isScalar(node) ? `, not ${JSON.stringify(node.value)}` : node && isSeq(node) ? ', not a list' : node && isMap(node) ? ', not a mapping' : ''}`,
      );
      return undefined;
    };
    switch (s.t) {
      case 'string':
      case 'text':
      case 'integer':
      case 'scalar':
      case 'boolean':
      case 'quantity': {
        if (!node || !isScalar(node) || node.value === null) return wrong();
        const v = node.value;
        if (s.t === 'boolean') return typeof v === 'boolean' ? v : wrong();
        if (s.t === 'string') {
          if (typeof v !== 'string') return wrong();
          if (s.enum && !s.enum.includes(v)) {
            const near = nearest(v, s.enum);
            err(
              label.endsWith('class') ? 'unknown-class' : 'bad-value',
              node,
              `${label} "${v}" is not ${describe(s)}${near ? `; did you mean "${near}"?` : ''}`,
            );
            return undefined;
          }
          if (s.pattern && !new RegExp(s.pattern).test(v)) {
            err('bad-value', node, `${label} "${v}" is not in the form ${s.patternHint ?? s.pattern}`);
            return undefined;
          }
          if (s.format === 'date' && !isCalendarDate(v)) {
            err('bad-value', node, `${label} "${v}" is not a date of the calendar (YYYY-MM-DD with a month 01–12 and a day that month has)`);
            return undefined;
          }
          return v;
        }
        if (s.t === 'text' || s.t === 'scalar')
          return typeof v === 'string' || typeof v === 'number' || typeof v === 'boolean' ? (s.t === 'text' ? String(v) : v) : wrong();
        if (s.t === 'integer') {
          if (typeof v !== 'number' || !Number.isInteger(v)) return wrong();
          if ((s.min !== undefined && v < s.min) || (s.max !== undefined && v > s.max)) {
            err('bad-value', node, `${label} must be ${s.max === undefined ? `at least ${s.min}` : `a whole number from ${s.min ?? 0} to ${s.max}`}, got ${v}`);
            return undefined;
          }
          return v;
        }
        // quantity: checked for form here, for kind where the figure is known (normalize.ts)
        if (typeof v !== 'string' && typeof v !== 'number') return wrong();
        const q = parseQuantity(v);
        if (!q.ok) {
          err(q.problem === 'unknown-unit' ? 'bad-value' : 'wrong-type', node, `${label}: ${q.message}`);
          return undefined;
        }
        if (s.kinds && !s.kinds.includes(q.kind)) {
          if (q.kind === 'unitless' && s.kinds.includes('frequency'))
            err('bare-frequency', node, `${label} ${v} has no unit; a frequency always carries one: write ${v} GHz, ${v} MHz, …`);
          else if (q.kind === 'unitless')
            err(
              'missing-unit',
              node,
              `${label} ${v} has no unit; expected ${describe(s)}, e.g. ${v} ${s.kinds[0] === 'dB' ? 'dB' : s.kinds[0] === 'deg' ? 'deg' : 'ns'}`,
            );
          else err('unit-mismatch', node, `${label} "${v}" is ${KIND_NAMES[q.kind]}; expected ${describe(s)}`);
          return undefined;
        }
        return v;
      }
      case 'object': {
        if (!node || !isMap(node)) return wrong();
        const out: { [k: string]: Plain } = {};
        const names = Object.keys(s.fields);
        for (const item of node.items as Pair<Node, Node>[]) {
          const key = isScalar(item.key) ? String(item.key.value) : null;
          if (key === null) {
            err('wrong-type', item.key as Node, `${label} has a key that is not plain text`);
            continue;
          }
          positions.set(`${path}#${key}`, posOf(item.key as Node));
          const field = s.fields[key];
          if (!field) {
            const near = nearest(key, names);
            err(
              'unknown-key',
              item.key as Node,
              `unknown key "${key}" in ${label}${near ? `; did you mean "${near}"?` : `; expected one of ${names.join(', ')}`}`,
            );
            continue;
          }
          const v = walk(item.value as Node | null, field, path ? `${path}.${key}` : key, key);
          if (v !== undefined) out[key] = v;
        }
        for (const [k, f] of Object.entries(s.fields)) {
          if (f.required && !node.items.some((i: Pair) => isPair(i) && isScalar(i.key) && String(i.key.value) === k)) {
            err('missing-key', node, `${label} needs "${k}" (${f.description})`);
          }
        }
        return out;
      }
      case 'map': {
        if (!node || !isMap(node)) return wrong();
        const out: { [k: string]: Plain } = {};
        for (const item of node.items as Pair<Node, Node>[]) {
          const raw = isScalar(item.key) ? item.key.value : null;
          const key = raw === null ? null : String(raw);
          const ok = key !== null && (s.keys === 'integer' ? /^[1-9]\d*$/.test(key) : new RegExp(NAME_PATTERN).test(key));
          if (!ok) {
            err(
              'bad-value',
              item.key as Node,
              `${label}: key ${JSON.stringify(raw)} must be ${s.keys === 'integer' ? 'a port number (1, 2, …)' : 'a name of letters, digits, - and _ starting with a letter'}`,
            );
            continue;
          }
          positions.set(`${path}#${key}`, posOf(item.key as Node));
          const v = walk(item.value as Node | null, s.value, `${path}.${key}`, `${label} ${key}`);
          if (v !== undefined) out[key as string] = v;
        }
        return out;
      }
      case 'array': {
        if (!node || !isSeq(node)) return wrong();
        if (s.minItems && node.items.length < s.minItems) err('bad-value', node, `${label} needs at least ${s.minItems} entr${s.minItems === 1 ? 'y' : 'ies'}`);
        if (s.maxItems && node.items.length > s.maxItems) err('bad-value', node, `${label} holds at most ${s.maxItems} entries`);
        const out: Plain[] = [];
        node.items.forEach((item, i) => {
          const v = walk(item as Node, s.items, `${path}.${i}`, `${label} entry ${i + 1}`);
          out.push(v === undefined ? null : v);
        });
        return out;
      }
      case 'oneOrMany': {
        if (node && isSeq(node)) {
          if (node.items.length === 0) err('bad-value', node, `${label} must list at least one entry`);
          const out: Plain[] = [];
          node.items.forEach((item, i) => {
            const v = walk(item as Node, s.items, `${path}.${i}`, label);
            if (v !== undefined) out.push(v);
          });
          return out;
        }
        const v = walk(node, s.items, `${path}.0`, label);
        positions.set(path, posOf(node));
        return v === undefined ? undefined : [v];
      }
    }
  }

  const value = walk(root, schema, '', rootLabel) ?? null;
  return { value, errors, positions };
}
