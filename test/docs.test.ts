/** The README documents every figure and every part-file key the code knows (and no others). */
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { FIGURES } from '../src/figures/registry.js';
import { PART_SCHEMA } from '../src/part-file/part-schema.js';

const readme = readFileSync(join(import.meta.dirname, '../README.md'), 'utf8');

describe('README', () => {
  it('lists every figure in its figure table', () => {
    const table = readme.slice(readme.indexOf('## Figures'), readme.indexOf('## Where things are'));
    for (const id of FIGURES.keys()) expect(table, id).toContain(`\`${id}\``);
  });
  it('lists every top-level part-file key', () => {
    const section = readme.slice(readme.indexOf('## The part file'), readme.indexOf('## Figures'));
    if (PART_SCHEMA.t !== 'object') throw new Error('the part schema is an object');
    for (const key of Object.keys(PART_SCHEMA.fields)) expect(section, key).toContain(`\`${key}\``);
  });
});
