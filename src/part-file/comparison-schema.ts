/**
 * The comparison file (content/comparisons/<slug>.yaml), defined once: the
 * validator reads it and `scatterbook schema comparison` publishes it. Its
 * bands and limits are a part file's, word for word (same keys, same figures,
 * same rules), less what only a vendor's own units can have (conditions,
 * how a limit is assured).
 */
import { MAX_PORT, BANDS, limitFields, PART_SCHEMA } from './part-schema.js';
import type { Field, Schema } from './schema-dsl.js';

const partFields = (PART_SCHEMA as Extract<Schema, { t: 'object' }>).fields;
const str = (description: string): Schema => ({ t: 'string', description });

const requirementFields: Record<string, Field> = Object.fromEntries(
  Object.entries(limitFields).filter(([k]) => k !== 'when' && k !== 'assured-by' && k !== 'change'),
);

export const COMPARISON_SCHEMA: Schema = {
  t: 'object',
  description: "Candidate parts compared side by side over the engineer's bands, against the engineer's requirement.",
  fields: {
    title: { ...str('what is being chosen, e.g. Filter shortlist for the 2.4 GHz front end'), required: true },
    description: str('a paragraph on the application and what the requirement stands for'),
    date: {
      t: 'string',
      description: 'the date of this comparison, YYYY-MM-DD (a real calendar date)',
      pattern: '^\\d{4}-\\d{2}-\\d{2}$',
      patternHint: 'YYYY-MM-DD, e.g. 2026-11-20',
      format: 'date',
    },
    class: {
      ...partFields.class,
      required: false,
      description: 'the kind of component compared: chooses the default nominal of balance figures and the plots (default generic)',
    },
    reference: { t: 'scalar', description: 'the reference impedance every candidate is renormalized to, e.g. 50 ohm (also 50 Ω or 50; default 50 ohm)' },
    ways: partFields.ways,
    'phase-split': partFields['phase-split'],
    'mixed-mode': partFields['mixed-mode'],
    bands: { ...BANDS, required: true },
    limits: {
      t: 'array',
      minItems: 1,
      required: true,
      items: { t: 'object', fields: requirementFields, description: 'a figure over a band and the limit every candidate must meet' },
      description: 'the requirement, in the order of the comparison table',
    },
    candidates: {
      t: 'array',
      minItems: 1,
      required: true,
      description: "the parts compared, in the order of the table's columns",
      items: {
        t: 'object',
        description: 'one candidate: a catalog part (all its measured units) or Touchstone files (one per unit)',
        fields: {
          label: { ...str('how the comparison names it (unique)'), required: true },
          vendor: str('who makes it'),
          notes: str('a note on the candidate (price, lead time, where the data come from)'),
          part: str('a part file of the catalog, relative to this file, e.g. ../parts/vt-bpf-2450/part.yaml: all its measured units'),
          files: {
            t: 'array',
            minItems: 1,
            items: str('a Touchstone file, relative to this file'),
            description: 'Touchstone files, one per measured unit, relative to this file',
          },
          file: str('one Touchstone file (a one-unit candidate), relative to this file'),
          ports: {
            t: 'map',
            keys: 'integer',
            value: { t: 'integer', min: 1, max: MAX_PORT, description: 'the port of the file' },
            description:
              "our port → the file's port, e.g. {1: 2, 2: 1} when the file measured the part the other way round; our ports are numbered 1 to N, file ports left out are terminated in their reference impedance",
          },
        },
      },
    },
    baseline: str('the label of the candidate the others are compared against (differences per limit and difference traces)'),
  },
};
