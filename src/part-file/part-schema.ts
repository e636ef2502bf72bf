/**
 * The part file, defined once. The validator reads it, the JSON Schema is
 * generated from it (npm run schema → schema/part.schema.json), and the
 * documentation's key list is checked against it.
 */
import { CLASSES } from '../classes/registry.js';
import type { Field, Schema } from './schema-dsl.js';

/** Ranges of the part file's numbers (documented in the README and carried into the JSON Schema). */
export const MAX_PORT = 999;
export const MAX_APERTURE = 100;
export const MAX_LEVEL_DB = 60;
/** How a limit is assured for shipped parts (shown as a footnote mark on the datasheet). */
export const ASSURANCES = ['every-unit', 'sample', 'design'] as const;
export type Assurance = (typeof ASSURANCES)[number];

export type { PartClass } from '../classes/registry.js';

const str = (description: string, extra: Partial<Extract<Schema, { t: 'string' }>> = {}): Schema => ({ t: 'string', description, ...extra });
const text = (description: string): Schema => ({ t: 'text', description });
const conditions: Schema = {
  t: 'map',
  keys: 'name',
  description: 'Measurement conditions by name, e.g. temperature: 25 °C; units with equal conditions form a group',
  value: { t: 'scalar', description: "the condition's value as written (compared as text)" },
};

/** Fields shared by limits and reported figures. */
const figureFields: Record<string, Field> = {
  figure: { ...str('the figure: a name from the figure list or a key of custom-figures'), required: true },
  on: {
    t: 'oneOrMany',
    description: 'the S-parameters it covers, e.g. S21 or [S11, S22]; S21 is into port 2 from port 1; ports above 9 need a comma: S10,12',
    items: str('an S-parameter name such as S21 or S10,12'),
  },
  band: { ...str('the band (a key of bands) the figure is evaluated over'), required: true },
  ports: {
    t: 'array',
    minItems: 2,
    maxItems: 2,
    items: { t: 'integer', min: 1, max: MAX_PORT, description: 'a port number' },
    description: 'stability figures: the input and output port (default [1, 2])',
  },
  aperture: {
    t: 'integer',
    min: 1,
    max: MAX_APERTURE,
    description: `group delay: difference over ±N measured points, 1 to ${MAX_APERTURE} (default 1, plain central differences)`,
  },
  level: {
    t: 'quantity',
    kinds: ['dB'],
    description: `bandwidth and centre frequency: how far below the best insertion loss the band edges sit, above 0 and at most ${MAX_LEVEL_DB} dB (default 3 dB)`,
  },
  when: { ...conditions, description: 'only the units measured under these conditions, e.g. {temperature: 85 °C}' },
  label: str('a name for this row of the tables, replacing the figure name'),
};

export const limitFields: Record<string, Field> = {
  ...figureFields,
  max: { t: 'quantity', description: "the largest value allowed (with the figure's unit)" },
  min: { t: 'quantity', description: 'the smallest value allowed' },
  nominal: { t: 'quantity', description: 'the intended value; with tolerance, the allowed window is nominal ± tolerance' },
  tolerance: { t: 'quantity', description: "half the width of the allowed window around nominal (nominal defaults to the figure's own: 0 for balances)" },
  change: {
    t: 'object',
    description:
      'qualification: the limit bounds the change of the figure per unit between two stages (the value at `to` minus the value at `from`, point by point), e.g. {from: {stage: initial}, to: {stage: after thermal cycling}}; a unit matches a stage by its serial and conditions',
    fields: {
      from: { ...conditions, description: 'the conditions of the earlier stage, e.g. {stage: initial}', required: true },
      to: { ...conditions, description: 'the conditions of the later stage, e.g. {stage: after thermal cycling}', required: true },
    },
  },
  'assured-by': str(
    'how the vendor assures the limit for parts it ships: every-unit (each unit is tested against it), sample (characterised on a sample, not tested on every unit) or design (by design, not tested); without it the limit is checked on the listed units only',
    { enum: ASSURANCES },
  ),
};

function plotFields(): Record<string, Field> {
  return {
    figure: { ...str('the figure drawn (a trace figure: a value at every point)'), required: true },
    on: { t: 'oneOrMany', description: "the S-parameters drawn (default: those of the figure's limits)", items: str('an S-parameter name') },
    band: str('draw only this band (default: the whole measured range)'),
    range: str("all: the whole measured range; limits: around the bands of the figure's limits", { enum: ['all', 'limits'] }),
    title: str("the plot's title"),
  };
}

/** Named frequency bands (part files and comparison files). */
export const BANDS: Schema = {
  t: 'map',
  keys: 'name',
  description: 'named frequency bands',
  value: {
    t: 'object',
    description: 'a band from one frequency to another',
    fields: {
      from: { t: 'quantity', kinds: ['frequency'], description: 'lower edge, with its unit', required: true },
      to: { t: 'quantity', kinds: ['frequency'], description: 'upper edge, with its unit', required: true },
    },
  },
};

export const PART_SCHEMA: Schema = {
  t: 'object',
  description: 'One component in a scatterbook catalog: what it is, its measured units, its bands and the limits its datasheet promises.',
  fields: {
    part: { ...text('the part number'), required: true },
    title: str('a one-line title, e.g. Bandpass filter, 2.40–2.50 GHz'),
    class: { ...str('the component class', { enum: CLASSES }), required: true },
    revision: text('the revision of this datasheet'),
    date: str('the date of this revision, YYYY-MM-DD (a real calendar date)', {
      pattern: '^\\d{4}-\\d{2}-\\d{2}$',
      patternHint: 'YYYY-MM-DD, e.g. 2026-11-20',
      format: 'date',
    }),
    vendor: str("the vendor, when it differs from the catalog's"),
    description: str('a paragraph describing the part'),
    notes: str('notes for the datasheet, in Markdown (raw HTML is not rendered)'),
    package: str('package or housing'),
    connector: str('RF connectors'),
    'operating-temperature': str('operating temperature range, e.g. −40 to +85 °C'),
    'operating-band': str(
      "the band (a key of bands) the part is specified for, shown as its headline (default: the band of the class's main transmission limit, e.g. a filter's insertion-loss passband)",
    ),
    features: {
      t: 'array',
      items: str('a feature in a few words'),
      description: 'the features line of the datasheet, e.g. [Low insertion loss, SMA connectors]',
    },
    weight: str('the weight, e.g. 12 g'),
    outline: str(
      "an outline drawing: an image file in the content folder's assets/, written relative to the content folder (e.g. assets/vt-bpf-2450-outline.svg)",
    ),
    ordering: {
      t: 'array',
      description: 'ordering information: one entry per orderable variant',
      items: {
        t: 'object',
        description: 'an orderable variant',
        fields: { code: { ...text('the ordering code'), required: true }, description: { ...str('what the variant is'), required: true } },
      },
    },
    declared: {
      t: 'array',
      description:
        'specifications no Touchstone file carries (P1dB, OIP3, supply current, power handling, switching time …), shown in the specification table marked as declared by the vendor',
      items: {
        t: 'object',
        description: 'a declared specification',
        fields: {
          parameter: { ...str('e.g. Output power at 1 dB compression'), required: true },
          min: { t: 'scalar', description: 'the minimum, as written' },
          typ: { t: 'scalar', description: 'the typical value, as written' },
          max: { t: 'scalar', description: 'the maximum, as written' },
          unit: { ...str('the unit, e.g. dBm, mA, V, ns'), required: true },
          conditions: str('the conditions, e.g. 2 GHz, 25 °C, Vd = 5 V'),
        },
      },
    },
    ports: {
      t: 'map',
      keys: 'integer',
      value: str("the port's name"),
      description: 'port number → name (default "Port n"); every number must be a port of the measured files',
    },
    ways: { t: 'integer', min: 2, max: MAX_PORT, description: 'dividers: the number of outputs N for excess loss (default: ports − 1)' },
    'phase-split': {
      t: 'quantity',
      kinds: ['deg'],
      description: 'hybrids and baluns: the intended phase difference between outputs (default 90 deg for a hybrid, 180 deg for a balun)',
    },
    'mixed-mode': {
      t: 'object',
      description: 'how single-ended ports pair into mixed-mode ports, for parameters such as Sdd21',
      fields: {
        pairs: {
          t: 'array',
          minItems: 1,
          required: true,
          description: 'for mixed-mode port 1, 2, …: its [positive, negative] single-ended ports, e.g. [[1, 2], [3, 4]]',
          items: { t: 'array', minItems: 2, maxItems: 2, items: { t: 'integer', min: 1, max: MAX_PORT, description: 'a port number' }, description: 'a pair' },
        },
      },
    },
    'typical-at': {
      ...conditions,
      description:
        'the conditions typical values are quoted at, e.g. {temperature: 25 °C}: typical comes from the units measured there, limits still from every unit they cover',
    },
    measurements: {
      t: 'array',
      minItems: 1,
      description: 'one entry per measured unit',
      items: {
        t: 'object',
        description: 'a measured unit',
        fields: {
          unit: { ...text("the unit's serial number"), required: true },
          file: { ...str('its Touchstone file, relative to this part file; never outside the content folder'), required: true },
          conditions,
          notes: str('a note on this measurement'),
          instrument: str('the network analyser (and test set) it was measured on'),
          calibration: str('the calibration: method, kit, date'),
          date: str('the date of the measurement, YYYY-MM-DD (a real calendar date)', {
            pattern: '^\\d{4}-\\d{2}-\\d{2}$',
            patternHint: 'YYYY-MM-DD',
            format: 'date',
          }),
          operator: str('who measured it'),
          lot: text('the production lot the unit comes from (lot statistics are grouped by it)'),
        },
      },
    },
    bands: BANDS,
    limits: {
      t: 'array',
      items: { t: 'object', fields: limitFields, description: 'a figure over a band and the limit it must meet' },
      description: 'the limits the datasheet promises, in the order of its compliance table',
    },
    report: {
      t: 'array',
      items: { t: 'object', fields: figureFields, description: 'a figure to report without a limit' },
      description: "figures reported without a limit (their worst follows the figure's bad direction)",
    },
    'custom-figures': {
      t: 'map',
      keys: 'name',
      description: "figures of this part's own, as expressions over whole traces",
      value: {
        t: 'object',
        description: 'a custom figure',
        fields: {
          expression: {
            ...str(
              'e.g. db(S31) - db(S41); functions: db, loss_db, magnitude, phase_deg, unwrapped_phase_deg, group_delay, vswr, real_part, imag_part, and mathjs arithmetic',
            ),
            required: true,
          },
          unit: { ...str('the unit of the result', { enum: ['dB', 'deg', 's', ''] }), required: true },
          worse: { ...str('which way is worse when there is no limit', { enum: ['higher', 'lower'] }), required: true },
          title: str('a human name for tables and plots'),
        },
      },
    },
    plots: {
      t: 'array',
      items: { t: 'object', fields: plotFields(), description: 'a plot' },
      description: 'the plots of the datasheet, replacing the class defaults',
    },
    'extra-plots': { t: 'array', items: { t: 'object', fields: plotFields(), description: 'a plot' }, description: 'plots added after the class defaults' },
    ratings: {
      t: 'array',
      description: 'absolute maximum ratings',
      items: {
        t: 'object',
        description: 'one rating',
        fields: {
          parameter: { ...str('e.g. RF input power, CW'), required: true },
          value: { ...text('e.g. +30 dBm'), required: true },
          notes: str('conditions of the rating'),
        },
      },
    },
    cautions: { t: 'array', items: str('a caution in plain words'), description: 'cautions for handling and use, printed with the class defaults' },
  },
};
