/**
 * One source for the schema: the published JSON Schema is generated from the
 * validator's own definition, the committed copy is current, and every part
 * file in the demo catalog passes an independent JSON Schema validator (Ajv,
 * draft 2020-12) as well as our own.
 */
import { readdirSync, readFileSync, existsSync } from 'node:fs';
import { join } from 'node:path';
import { Ajv2020 } from 'ajv/dist/2020.js';
import { parse } from 'yaml';
import { describe, expect, it } from 'vitest';
import { comparisonJsonSchema, comparisonJsonSchemaText, partJsonSchema, partJsonSchemaText } from '../../src/part-file/json-schema.js';
import { loadComparisonText } from '../../src/part-file/comparison.js';
import { loadPartText } from '../../src/part-file/load.js';

const CONTENT = join(import.meta.dirname, '../../content');
const parts = readdirSync(join(CONTENT, 'parts'))
  .map((d) => join(CONTENT, 'parts', d, 'part.yaml'))
  .filter(existsSync);

describe('the part file schema', () => {
  const ajv = new Ajv2020({ allErrors: true, strict: false });
  const check = ajv.compile(partJsonSchema());

  it('content/part.schema.json is the generated schema (npm run schema)', () => {
    expect(readFileSync(join(CONTENT, 'part.schema.json'), 'utf8')).toBe(partJsonSchemaText());
  });

  it('every demo part file passes Ajv and our validator', () => {
    expect(parts.length).toBeGreaterThan(0);
    for (const p of parts) {
      const text = readFileSync(p, 'utf8');
      expect(check(parse(text, { version: '1.2' })), `${p}: ${JSON.stringify(check.errors)}`).toBe(true);
      expect(loadPartText(text, p, () => ({ ok: false, message: 'not compiled here' })).errors.filter((e) => e.code !== 'bad-expression')).toEqual([]);
    }
  });

  it('Ajv and our validator agree on broken files: unknown keys, bad classes, bare frequencies, missing keys', () => {
    const base = readFileSync(parts[0], 'utf8');
    const broken = [
      base.replace(/^limits:/m, 'limts:'),
      base.replace(/^class: \w+/m, 'class: filtre'),
      base.replace(/from: ([\d.]+) [GM]Hz/, 'from: $1'),
      base.replace(/^part: .*$/m, ''),
      // malformed quantities: the sign class once was a range U+002B–U+2212 that let letters and ~ through
      base.replace(/max: ([\d.]+) dB/, 'max: l5 dB'),
      base.replace(/max: ([\d.]+) dB/, 'max: ~2.5 dB'),
      base.replace(/from: ([\d.]+) ([GM]Hz)/, 'from: x$1 $2'),
      // out of range
      base.replace(/^date: .*$/m, 'date: 2026-1-5'),
      base.replace(/^limits:/m, 'limits:\n  - {figure: group-delay, on: S21, band: passband, max: 5 ns, aperture: 1000}'),
    ];
    for (const text of broken) {
      expect(check(parse(text, { version: '1.2' }))).toBe(false);
      expect(loadPartText(text, 'x.yaml').errors.length).toBeGreaterThan(0);
    }
  });
});

describe('the comparison file schema', () => {
  const ajv = new Ajv2020({ allErrors: true, strict: false });
  const check = ajv.compile(comparisonJsonSchema());
  const files = readdirSync(join(CONTENT, 'comparisons'))
    .filter((f) => f.endsWith('.yaml'))
    .map((f) => join(CONTENT, 'comparisons', f));

  it('content/comparison.schema.json is the generated schema (npm run schema)', () => {
    expect(readFileSync(join(CONTENT, 'comparison.schema.json'), 'utf8')).toBe(comparisonJsonSchemaText());
  });

  it('every demo comparison passes Ajv and our validator', () => {
    expect(files.length).toBeGreaterThan(0);
    for (const f of files) {
      const text = readFileSync(f, 'utf8');
      expect(check(parse(text, { version: '1.2' })), `${f}: ${JSON.stringify(check.errors)}`).toBe(true);
      expect(loadComparisonText(text, f).errors).toEqual([]);
    }
  });

  it('Ajv and our validator agree on broken files: unknown keys, a limit key of part files only, a bare frequency, no candidates', () => {
    const base = readFileSync(files[0], 'utf8');
    const broken = [
      base.replace(/^limits:/m, 'limts:'),
      base.replace(/^baseline:/m, 'base-line:'),
      base.replace('max: 2.0 dB}', 'max: 2.0 dB, assured-by: every-unit}'),
      base.replace(/from: 2.70 GHz/, 'from: 2.70'),
      base.replace(/^candidates:[\s\S]*?^baseline:.*$/m, 'candidates: []'),
    ];
    for (const text of broken) {
      expect(check(parse(text, { version: '1.2' })), text.slice(0, 0)).toBe(false);
      expect(loadComparisonText(text, 'x.yaml').errors.length).toBeGreaterThan(0);
    }
  });
});
