/**
 * content/site.yaml: the catalog's own settings, every one optional, with
 * defaults that look right with no file at all. Checked by the same schema
 * language as part files.
 */
import { LineCounter, parseDocument } from 'yaml';
import { CLASSES } from '../classes/registry.js';
import type { Position, SpecError } from '../part-file/diagnostics.js';
import type { Schema } from '../part-file/schema-dsl.js';
import { validate, type Plain } from '../part-file/validate.js';

export interface SiteSettings {
  readonly vendor: string;
  readonly tagline: string;
  /** Path of a logo inside the content folder's assets/, or null. */
  readonly logo: string | null;
  readonly accent: string;
  readonly paper: 'A4' | 'Letter';
  readonly footer: string;
  /** The vendor's own disclaimer, or null: each datasheet composes one from how its limits are assured. */
  readonly disclaimer: string | null;
  readonly baseUrl: string;
  readonly stylesheet: string | null;
  /** Build the QA-facing test reports (page and PDF) of every part. */
  readonly reports: boolean;
  /** Publish the measured Touchstone files and link them from the datasheet. */
  readonly publishData: boolean;
  /** The order of the classes on the index (unlisted classes follow in the registry's order). */
  readonly classOrder: readonly string[];
}

export const SITE_SCHEMA: Schema = {
  t: 'object',
  description: 'Settings of a scatterbook catalog site',
  fields: {
    vendor: { t: 'string', description: "the vendor's name, on every page" },
    tagline: { t: 'string', description: "a line under the vendor's name on the index" },
    logo: { t: 'string', description: "a logo image in the content folder's assets/, relative to the content folder (e.g. assets/logo.svg)" },
    accent: { t: 'string', pattern: '^#[0-9a-fA-F]{6}$', patternHint: '#RRGGBB', description: 'the accent colour, #RRGGBB' },
    paper: { t: 'string', enum: ['A4', 'Letter'], description: 'paper size of the PDFs and print stylesheet' },
    footer: { t: 'string', description: 'text at the foot of every page' },
    disclaimer: { t: 'string', description: 'the disclaimer under every datasheet, replacing the one each datasheet composes from how its limits are assured' },
    'base-url': { t: 'string', description: 'where the site will be published, e.g. https://example.invalid/datasheets/' },
    stylesheet: { t: 'string', description: "an extra stylesheet in the content folder's assets/, relative to the content folder (e.g. assets/vendor.css)" },
    reports: { t: 'boolean', description: "true (default) to build each part's test report, page and PDF; false keeps them out of a public build" },
    'publish-data': {
      t: 'boolean',
      description: 'true (default) to publish the measured Touchstone files and link them from the datasheet; false keeps them out',
    },
    'class-order': {
      t: 'array',
      items: { t: 'string', enum: CLASSES, description: 'a class' },
      description:
        'the order of the classes on the index (default: filters, attenuators, amplifiers, dividers, couplers, hybrids, circulators, isolators, cables, switches, baluns, others)',
    },
  },
};

export function defaultSettings(): SiteSettings {
  return {
    vendor: 'Datasheets',
    tagline: '',
    logo: null,
    accent: '#1f4e8c',
    paper: 'A4',
    footer: '',
    disclaimer: null,
    baseUrl: '/',
    stylesheet: null,
    reports: true,
    publishData: true,
    classOrder: CLASSES,
  };
}

export function loadSettings(text: string | null, file: string): { value: SiteSettings; errors: SpecError[]; positions: ReadonlyMap<string, Position> } {
  const d = defaultSettings();
  const none = new Map<string, Position>();
  if (text === null) return { value: d, errors: [], positions: none };
  const lines = new LineCounter();
  const doc = parseDocument(text, { version: '1.2', lineCounter: lines, prettyErrors: false });
  if (doc.errors.length) {
    return {
      value: d,
      errors: doc.errors.map((e) => ({ code: 'yaml-syntax', file, message: `YAML syntax: ${e.message.split(' at line')[0]}`, ...toPos(lines, e.pos[0]) })),
      positions: none,
    };
  }
  if (doc.contents === null) return { value: d, errors: [], positions: none };
  const r = validate(doc.contents, SITE_SCHEMA, file, lines, (a) => a.resolve(doc));
  const v = (r.value ?? {}) as Record<string, Plain>;
  const s = (k: string) => (typeof v[k] === 'string' ? (v[k] as string) : undefined);
  return {
    value: {
      vendor: s('vendor') ?? d.vendor,
      tagline: s('tagline') ?? d.tagline,
      logo: s('logo') ?? null,
      accent: s('accent') ?? d.accent,
      paper: (s('paper') as SiteSettings['paper']) ?? d.paper,
      footer: s('footer') ?? d.footer,
      disclaimer: s('disclaimer') ?? d.disclaimer,
      baseUrl: s('base-url') ?? d.baseUrl,
      stylesheet: s('stylesheet') ?? null,
      reports: v.reports !== false,
      publishData: v['publish-data'] !== false,
      classOrder: Array.isArray(v['class-order']) ? (v['class-order'].filter((c) => typeof c === 'string') as string[]) : d.classOrder,
    },
    errors: r.errors,
    positions: r.positions,
  };
}

/**
 * Why a logo or stylesheet path of site.yaml cannot be used, or null: it must
 * name a file under the content folder's assets/ (which is copied into the
 * site), written relative to the content folder; never a remote address, an
 * absolute path or a path that leaves the folder. `isFile` answers for the
 * resolved path (the caller owns the file system).
 */
export function assetPathProblem(key: string, value: string, isFile: (relativePath: string) => boolean | 'outside'): string | null {
  if (/^[a-z][a-z0-9+.-]*:/i.test(value) || value.startsWith('//'))
    return `${key} "${value}" is a remote address; the site carries its own files: put the file in the content folder's assets/ and write assets/…`;
  if (value.startsWith('/') || /^[a-z]:[\\/]/i.test(value))
    return `${key} "${value}" is an absolute path; write it relative to the content folder, e.g. assets/${value.split(/[\\/]/).pop()}`;
  const parts = value.split(/[\\/]/);
  if (parts.includes('..') || parts[0] !== 'assets' || parts.length < 2)
    return `${key} "${value}" must lie in the content folder's assets/ (which is copied into the site), e.g. assets/${parts.pop()}`;
  const found = isFile(value);
  if (found === 'outside') return `${key} "${value}" leads outside the content folder through a link`;
  if (!found) return `${key} "${value}" does not exist in the content folder (or is not a file)`;
  return null;
}

function toPos(lines: LineCounter, offset: number) {
  const p = lines.linePos(offset);
  return { line: p.line, column: p.col };
}
