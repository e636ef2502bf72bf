/** The published JSON Schema of part files, generated from PART_SCHEMA (the validator's own definition). */
import { PART_SCHEMA } from './part-schema.js';
import { toJsonSchema } from './schema-dsl.js';

export const PART_SCHEMA_ID = 'https://scatterbook.invalid/schema/part.schema.json';

export function partJsonSchema(): object {
  return { $schema: 'https://json-schema.org/draft/2020-12/schema', $id: PART_SCHEMA_ID, title: 'scatterbook part file', ...toJsonSchema(PART_SCHEMA) };
}

export function partJsonSchemaText(): string {
  return `${JSON.stringify(partJsonSchema(), null, 2)}\n`;
}
