/**
 * Exports for machine readers and archives: each part's figures as JSON
 * (exactly `figures --json`) and CSV, the whole catalog's the same, and the
 * median of a part's measurements as a Touchstone file marked as derived.
 *
 * CSV (RFC 4180, UTF-8, a header row): one row per part × limit (or reported
 * figure) × measurement, numbers unrounded in the units `figures --json` uses
 * (dB, deg, s, Hz, plain), "Infinity"/"-Infinity" where not finite, empty
 * where none; the columns are CSV_COLUMNS.
 *
 * The median Touchstone file: at each frequency, each S entry's real part
 * and imaginary part are each the median over the measurements (the mean of
 * the middle two for an even count); written only when every measurement has
 * the same frequencies, ports and references and none is in mixed-mode order.
 */
import { median } from '../evaluate/stats.js';
import { makeNetwork, type Network } from '../network/network.js';
import { writeTouchstone } from '../touchstone/write.js';
import { medianText } from '../io/spilled.js';

export const CSV_COLUMNS = [
  'part',
  'revision',
  'figure',
  'on',
  'band',
  'from_hz',
  'to_hz',
  'unit',
  'limit_min',
  'limit_max',
  'limit_nominal',
  'limit_tolerance',
  'change_from',
  'change_to',
  'worst',
  'worst_at_hz',
  'worst_unit',
  'typical',
  'margin',
  'pass',
  'measurement',
  'measurement_worst',
  'measurement_at_hz',
  'measurement_margin',
  'measurement_pass',
] as const;

type Json = { part: string; revision: string; results: Array<Record<string, unknown> & { units: Array<Record<string, unknown>> }> };

const cellText = (v: unknown): string =>
  v === null || v === undefined ? '' : typeof v === 'number' ? String(v) : typeof v === 'boolean' ? String(v) : String(v);
const quote = (s: string) => (/[",\r\n]/.test(s) ? `"${s.replace(/"/g, '""')}"` : s);
const stage = (c: unknown) =>
  c && typeof c === 'object'
    ? Object.entries(c as Record<string, string>)
        .map(([k, v]) => `${k}=${v}`)
        .join(';')
    : '';

/** The CSV rows (without the header) of one part's figures --json. */
export function csvRows(j: Json): string[] {
  return j.results.flatMap((r) => {
    const limit = (r.limit ?? {}) as Record<string, unknown>;
    const change = r.change as { from: unknown; to: unknown } | undefined;
    const head = [
      j.part,
      j.revision,
      r.figure,
      (r.on as string[]).join(' '),
      r.band,
      r.fromHz,
      r.toHz,
      r.unit,
      limit.min,
      limit.max,
      limit.nominal,
      limit.tolerance,
      stage(change?.from),
      stage(change?.to),
      r.worst,
      r.worstAtHz,
      r.worstUnit,
      r.typical,
      r.margin,
      r.pass,
    ];
    return r.units.map((u) => [...head, u.unit, u.worst, u.atHz, u.margin, u.pass].map((v) => quote(cellText(v))).join(','));
  });
}

export const csvText = (parts: readonly Json[]) => [CSV_COLUMNS.join(','), ...parts.flatMap(csvRows)].join('\r\n') + '\r\n';

/** The median network of measurements on one grid, or null with the reason. */
export function medianNetwork(nets: readonly Network[]): { value: Network } | { why: string } {
  if (!nets.length) return { why: 'no measurements' };
  const [a] = nets;
  for (const n of nets.slice(1)) {
    if (n.ports !== a.ports) return { why: 'the measurements have different port counts' };
    if (n.freqHz.length !== a.freqHz.length || n.freqHz.some((f, k) => f !== a.freqHz[k])) return { why: 'the measurements are on different frequency grids' };
    if (n.z0.some((z, i) => z !== a.z0[i])) return { why: 'the measurements have different reference impedances' };
  }
  const s = new Float64Array(a.s.length);
  const column: number[] = new Array(nets.length);
  for (let i = 0; i < s.length; i++) {
    for (let u = 0; u < nets.length; u++) column[u] = nets[u].s[i];
    s[i] = median(column);
  }
  return { value: makeNetwork(a.freqHz, a.z0, s, a.ports) };
}

/** The median as Touchstone text, marked as derived. */
export function medianTouchstone(part: string, revision: string, labels: readonly string[], net: Network): string {
  return writeTouchstone(net, {
    format: 'RI',
    comments: [
      `DERIVED DATA, not a measurement: the median of ${labels.length} measurements of ${part}${revision ? ` revision ${revision}` : ''} (${labels.join(', ')})`,
      "At each frequency, each S entry's real and imaginary parts are each the median over the measurements; made by scatterbook",
    ],
  });
}

/** Writes the exports of a built catalog into its site folder (the staging folder of a build). */
export function writeExports(
  catalog: {
    readonly parts: ReadonlyArray<{
      readonly slug: string;
      readonly figuresJson: string;
      readonly exports: {
        readonly json: string;
        readonly csv: string;
        readonly median: { readonly url: string; readonly text: string; readonly file?: string } | null;
      };
    }>;
    readonly version: string;
  },
  siteDir: string,
  write: (path: string, text: string) => void,
  options: { readonly medians?: boolean } = {},
): void {
  const all: Json[] = [];
  for (const p of catalog.parts) {
    const j = JSON.parse(p.figuresJson) as Json;
    all.push(j);
    write(`${siteDir}/${p.exports.json}`, `${JSON.stringify(j, null, 2)}\n`);
    write(`${siteDir}/${p.exports.csv}`, csvText([j]));
    if (p.exports.median && options.medians !== false) write(`${siteDir}/${p.exports.median.url}`, medianText(p.exports.median));
  }
  write(`${siteDir}/figures.json`, `${JSON.stringify({ tool: { name: 'scatterbook', version: catalog.version }, parts: all }, null, 2)}\n`);
  write(`${siteDir}/figures.csv`, csvText(all));
}
