/** The published JSON Schemas of part files and comparison files, generated from the validator's own definitions. */
import { COMPARISON_SCHEMA } from './comparison-schema.js';
import { PART_SCHEMA } from './part-schema.js';
import { toJsonSchema } from './schema-dsl.js';

export const PART_SCHEMA_ID = 'https://scatterbook.invalid/schema/part.schema.json';
export const COMPARISON_SCHEMA_ID = 'https://scatterbook.invalid/schema/comparison.schema.json';

export function partJsonSchema(): object {
  return { $schema: 'https://json-schema.org/draft/2020-12/schema', $id: PART_SCHEMA_ID, title: 'scatterbook part file', ...toJsonSchema(PART_SCHEMA) };
}

export function comparisonJsonSchema(): object {
  return {
    $schema: 'https://json-schema.org/draft/2020-12/schema',
    $id: COMPARISON_SCHEMA_ID,
    title: 'scatterbook comparison file',
    ...toJsonSchema(COMPARISON_SCHEMA),
  };
}

export function partJsonSchemaText(): string {
  return `${JSON.stringify(partJsonSchema(), null, 2)}\n`;
}

export function comparisonJsonSchemaText(): string {
  return `${JSON.stringify(comparisonJsonSchema(), null, 2)}\n`;
}
