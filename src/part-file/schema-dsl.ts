/**
 * A small schema language: one definition serves the validator (validate.ts)
 * and the published JSON Schema (toJsonSchema below), so the two cannot drift.
 */
import type { QuantityKind } from './quantity.js';

interface Base {
  readonly description: string;
}

export type Schema =
  | (Base & { readonly t: 'string'; readonly enum?: readonly string[]; readonly pattern?: string; readonly patternHint?: string; readonly format?: 'date' })
  | (Base & { readonly t: 'text' }) // a string, or a number/boolean written where text is meant (revision: 2)
  | (Base & { readonly t: 'integer'; readonly min?: number; readonly max?: number })
  | (Base & { readonly t: 'quantity'; readonly kinds?: readonly QuantityKind[] })
  | (Base & { readonly t: 'scalar' })
  | (Base & { readonly t: 'boolean' })
  | (Base & { readonly t: 'object'; readonly fields: Readonly<Record<string, Field>> })
  | (Base & { readonly t: 'map'; readonly keys: 'integer' | 'name'; readonly value: Schema })
  | (Base & { readonly t: 'array'; readonly items: Schema; readonly minItems?: number; readonly maxItems?: number })
  | (Base & { readonly t: 'oneOrMany'; readonly items: Schema });

export type Field = Schema & { readonly required?: boolean };

export const NAME_PATTERN = '^[A-Za-z][A-Za-z0-9_-]*$';

type Json = { [k: string]: unknown };

/** The JSON Schema (draft 2020-12) of a definition. */
export function toJsonSchema(s: Schema): Json {
  const d = { description: s.description };
  switch (s.t) {
    case 'string':
      return {
        ...d,
        type: 'string',
        ...(s.enum ? { enum: [...s.enum] } : {}),
        ...(s.pattern ? { pattern: s.pattern } : {}),
        ...(s.format ? { format: s.format } : {}),
      };
    case 'text':
      return { ...d, type: ['string', 'number', 'boolean'] };
    case 'integer':
      return { ...d, type: 'integer', ...(s.min !== undefined ? { minimum: s.min } : {}), ...(s.max !== undefined ? { maximum: s.max } : {}) };
    case 'quantity': {
      const units = unitPattern(s.kinds);
      const allowsBare = !s.kinds || s.kinds.includes('unitless');
      const str = { type: 'string', pattern: `^\\s*[+\\-−]?(\\d+\\.?\\d*|\\.\\d+)([eE][+\\-]?\\d+)?\\s*(${units})\\s*$` };
      return allowsBare ? { ...d, oneOf: [{ type: 'number' }, str] } : { ...d, ...str };
    }
    case 'scalar':
      return { ...d, type: ['string', 'number', 'boolean'] };
    case 'boolean':
      return { ...d, type: 'boolean' };
    case 'object': {
      const required = Object.entries(s.fields)
        .filter(([, f]) => f.required)
        .map(([k]) => k);
      return {
        ...d,
        type: 'object',
        additionalProperties: false,
        properties: Object.fromEntries(Object.entries(s.fields).map(([k, f]) => [k, toJsonSchema(f)])),
        ...(required.length ? { required } : {}),
      };
    }
    case 'map':
      return {
        ...d,
        type: 'object',
        propertyNames: { pattern: s.keys === 'integer' ? '^[1-9][0-9]*$' : NAME_PATTERN },
        additionalProperties: toJsonSchema(s.value),
      };
    case 'array':
      return {
        ...d,
        type: 'array',
        items: toJsonSchema(s.items),
        ...(s.minItems ? { minItems: s.minItems } : {}),
        ...(s.maxItems ? { maxItems: s.maxItems } : {}),
      };
    case 'oneOrMany': {
      const item = toJsonSchema(s.items);
      return { ...d, oneOf: [item, { type: 'array', items: item, minItems: 1 }] };
    }
  }
}

const UNIT_SPELLINGS: Record<QuantityKind, string> = {
  frequency: '[Hh][Zz]|[Kk][Hh][Zz]|[Mm][Hh][Zz]|[Gg][Hh][Zz]',
  dB: '[Dd][Bb]',
  deg: 'deg|°',
  time: 's|ms|us|µs|ns|ps',
  unitless: '',
};

function unitPattern(kinds?: readonly QuantityKind[]): string {
  const ks = kinds ?? (Object.keys(UNIT_SPELLINGS) as QuantityKind[]);
  return (
    ks
      .map((k) => UNIT_SPELLINGS[k])
      .filter(Boolean)
      .join('|') + (ks.includes('unitless') ? '|' : '')
  );
}
