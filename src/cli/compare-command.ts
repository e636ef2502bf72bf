/**
 * `scatterbook compare FILE… --band FROM..TO [--limit "FIGURE ON max|min VALUE"]… [--reference OHMS] [--json] [--strict]`:
 * the quick form of a comparison, for a first look without a comparison file.
 * Each Touchstone file is a candidate labelled by its file name; the band is
 * called "use"; each --limit is a requirement in a line of its own, e.g.
 * "insertion-loss S21 max 1.5 dB", "return-loss S11+S22 min 15 dB",
 * "phase-balance S21+S31 nominal 90 deg tolerance 5 deg". The requirement is
 * read as a part file would be, so every figure and rule of `figures` applies.
 */
import { basename, resolve } from 'node:path';
import { compareCandidates, type CandidateResult } from '../compare/compare.js';
import { comparisonJson } from '../compare/json.js';
import { printable } from '../format/escape.js';
import { bandRange, coarsestResolutionHz, trimNumber } from '../format/units.js';
import { formatLimit, formatValue } from '../format/values.js';
import { bandGaps, bestMargin, gapText, rankReasons } from '../compare/explain.js';
import { contentRootOf, evaluateComparisonFile } from '../pipeline/comparison.js';
import { formatSpecError } from '../part-file/diagnostics.js';
import type { NormalizedPart } from '../part-file/normalize.js';
import { readTouchstoneFile } from '../io/touchstone-file.js';
import { loadPartText } from '../part-file/load.js';
import { parseQuantity } from '../part-file/quantity.js';
import { formatDiagnostic } from '../touchstone/diagnostics.js';
import { parseArgs, UsageError, type FlagSpec } from './args.js';
import { EXIT, type Command, type ExitCode } from './command.js';
import { painter, type Terminal } from './terminal.js';

const FLAGS: FlagSpec[] = [
  { name: 'band', value: true, help: 'the band to compare over, FROM..TO with units, e.g. 2.40GHz..2.48GHz' },
  { name: 'limit', value: true, help: 'a requirement, e.g. "insertion-loss S21 max 1.5 dB" (repeat for more)' },
  { name: 'reference', value: true, help: 'the reference impedance every candidate is renormalized to, ohms (default 50)' },
  { name: 'json', help: 'print the comparison as JSON on stdout' },
  { name: 'strict', help: 'exit 3 when a candidate fails' },
];

const LIMIT = /^(\S+)\s+(\S+)\s+(.+)$/;
const BOUND = /(max|min|nominal|tolerance)\s+(\S+(?:\s+(?:[a-zA-Zµ°]+))?)/g;

/** The quick form's words as part-file YAML (lines of limits start at line LIMITS_LINE). */
export function requirementYaml(files: readonly string[], band: string, limits: readonly string[]): { yaml: string; problems: string[] } {
  const problems: string[] = [];
  const [from, to] = band.split('..');
  if (!from || !to) problems.push(`--band "${band}": expected FROM..TO with units, e.g. 2.40GHz..2.48GHz`);
  else for (const q of [from, to]) if (!parseQuantity(q).ok) problems.push(`--band "${band}": "${q}" is not a frequency with its unit`);
  const lines = limits.map((l) => {
    const m = LIMIT.exec(l.trim());
    if (!m) {
      problems.push(`--limit "${l}": expected FIGURE ON max|min VALUE [UNIT], e.g. "insertion-loss S21 max 1.5 dB"`);
      return '';
    }
    const bounds = [...m[3].matchAll(BOUND)].map((b) => `${b[1]}: ${JSON.stringify(b[2])}`);
    if (!bounds.length) problems.push(`--limit "${l}": no max, min or nominal … tolerance …`);
    return `  - {figure: ${JSON.stringify(m[1])}, on: ${JSON.stringify(m[2].split('+'))}, band: use, ${bounds.join(', ')}}`;
  });
  const units = files.map((f, i) => `  - {unit: ${JSON.stringify(`c${i + 1}`)}, file: ${JSON.stringify(basename(f))}}`);
  return {
    yaml: `part: comparison\nclass: generic\nmeasurements:\n${units.join('\n')}\nbands:\n  use: {from: ${JSON.stringify(from ?? '')}, to: ${JSON.stringify(to ?? '')}}\nlimits:\n${lines.join('\n')}\n`,
    problems,
  };
}

/** The side-by-side table: limits as rows, candidates as columns, the best margin of a row marked, the rank row, then the reasons and gaps. */
function table(requirement: NormalizedPart, results: readonly CandidateResult[], reasons: readonly string[], t: Terminal): string {
  const p = painter(t.stdout, t.env);
  const resolution = coarsestResolutionHz(results.flatMap((c) => c.units.map((u) => u.network.freqHz)));
  const head = ['', 'limit', ...results.map((c) => printable(c.label))];
  const rows = requirement.checks.map((check, i) => {
    const cells = results.map((c) => c.byCheck[i]);
    const best = bestMargin(results, i);
    return [
      printable(`${check.label} ${check.on.join(' ')} over ${check.band.name}`),
      formatLimit(check.limit, check.figure.unit),
      ...cells.map((r) =>
        r
          ? `${formatValue(r.worst, r.unit, resolution)} ${r.pass === false ? p.red('FAIL') : p.green('PASS')}${best !== null && r.margin === best ? ' *' : ''}`
          : 'no data',
      ),
    ];
  });
  rows.push(['rank', '', ...results.map((c) => (c.rank === null ? `— (${c.coverage === 'partial' ? 'partial data' : 'errors'})` : String(c.rank)))]);
  const visible = (x: string) => x.replace(/\x1b\[[0-9;]*m/g, '').length;
  const widths = head.map((_, i) => Math.max(head[i].length, ...rows.map((r) => visible(r[i]))));
  const line = (cells: string[]) =>
    cells
      .map((c, i) => c + ' '.repeat(Math.max(0, widths[i] - visible(c))))
      .join('  ')
      .trimEnd();
  const gaps = results.flatMap((c) => bandGaps(c).map((g) => `${printable(c.label)}: ${gapText(g)}`));
  return (
    [
      p.bold(line(head)),
      ...rows.map(line),
      '',
      ...reasons.map(printable),
      ...(gaps.length ? ['', ...gaps] : []),
      '',
      '* the largest margin of the row; worst values over the band, PASS/FAIL against the requirement',
    ].join('\n') + '\n'
  );
}

/** `compare COMPARISON.yaml`: the comparison file's candidates against its requirement. */
async function compareFile(file: string, args: ReturnType<typeof parseArgs>, t: Terminal): Promise<ExitCode> {
  const path = resolve(t.cwd, file);
  const outcome = await evaluateComparisonFile(path, contentRootOf(path), file);
  if (!outcome.comparison || outcome.errors.length) {
    for (const e of outcome.errors) t.stderr.write(`${formatSpecError(e, e.file === file ? outcome.source : undefined)}\n`);
    return EXIT.badInput;
  }
  const c = outcome.comparison;
  const results = outcome.results;
  for (const r of results) for (const w of r.warnings) t.stderr.write(`${formatSpecError(w, w.file === file ? outcome.source : undefined, 'warning')}\n`);
  if (args.flags.has('json')) t.stdout.write(`${JSON.stringify(comparisonJson(c.title, c.referenceOhms, results), null, 2)}\n`);
  else {
    let text = `${painter(t.stdout, t.env).bold(printable(c.title))} (every candidate at ${trimNumber(c.referenceOhms)} Ω)\n\n${table(c.requirement, results, outcome.reasons, t)}`;
    if (outcome.differences && c.baseline) {
      const lines = outcome.differences.flatMap((d) =>
        d.limits.flatMap((l) => {
          const check = c.requirement.checks[l.check];
          return l.worst === null
            ? []
            : [
                `  ${printable(d.label)}: ${check.label} ${check.on.join(' ')} over ${check.band.name}: ${l.worst > 0 ? '+' : ''}${formatValue(l.worst, check.figure.unit)}`,
              ];
        }),
      );
      if (lines.length) text += `\nworst minus the worst of ${printable(c.baseline)}:\n${lines.join('\n')}\n`;
    }
    t.stdout.write(text);
  }
  return args.flags.has('strict') && results.some((r) => !r.pass) ? EXIT.limitFailed : EXIT.ok;
}

export const compareCommand: Command = {
  name: 'compare',
  usage:
    'scatterbook compare COMPARISON.yaml [--json] [--strict]\n       scatterbook compare FILE… --band FROM..TO [--limit "FIGURE ON max|min VALUE"]… [--reference OHMS] [--json] [--strict]',
  flags: FLAGS,
  async run(argv, t) {
    const args = parseArgs(argv, FLAGS);
    if (!args.positionals.length) throw new UsageError('compare takes a comparison file, or one or more Touchstone files with --band');
    if (args.positionals.length === 1 && /\.ya?ml$/i.test(args.positionals[0])) {
      for (const f of ['band', 'limit', 'reference'])
        if (args.flags.has(f) || args.values.has(f))
          throw new UsageError(`--${f} belongs to the quick form; a comparison file sets its own bands, limits and reference`);
      return compareFile(args.positionals[0], args, t);
    }
    const band = args.flags.get('band');
    if (typeof band !== 'string') throw new UsageError('compare needs --band FROM..TO, e.g. --band 2.40GHz..2.48GHz');
    const refText = (args.flags.get('reference') as string | undefined) ?? '50';
    const reference = Number(refText.replace(/\s*(ohm|Ω)$/i, ''));
    if (!(reference > 0) || !Number.isFinite(reference)) throw new UsageError(`--reference needs a positive number of ohms, got "${refText}"`);
    const limits = args.values.get('limit') ?? [];
    const { yaml, problems } = requirementYaml(args.positionals, band, limits);
    const fail = (lines: string[]) => {
      for (const l of lines) t.stderr.write(`error: ${printable(l)}\n`);
      return EXIT.badInput;
    };
    if (problems.length) return fail(problems);
    const loaded = loadPartText(yaml, 'the requirement');
    if (!loaded.value) {
      // positions in the generated text are no use to the user: name the flag instead
      const limitLine = yaml.split('\n').indexOf('limits:') + 1;
      return fail(
        loaded.errors.map((e) =>
          e.line > limitLine && limits[e.line - limitLine - 1]
            ? `--limit "${limits[e.line - limitLine - 1]}": ${e.message}`
            : e.line > 0 && e.line <= limitLine
              ? `--band "${band}": ${e.message}`
              : e.message,
        ),
      );
    }
    const candidates = [];
    let unreadable = false;
    for (const [i, f] of args.positionals.entries()) {
      const r = readTouchstoneFile(resolve(t.cwd, f));
      for (const w of r.warnings) t.stderr.write(`${formatDiagnostic(f, w, 'warning')}\n`);
      if (!r.value) {
        for (const e of r.errors) t.stderr.write(`${formatDiagnostic(f, e, 'error')}\n`);
        unreadable = true;
        continue;
      }
      candidates.push({
        label: basename(f),
        units: [
          {
            unit: basename(f),
            file: f,
            network: r.value.network,
            noise: r.value.noise,
            mixedModeOrder: r.value.info.mixedModeOrder,
            conditions: {},
            fileAt: loaded.value.measurements[i].fileAt,
          },
        ],
      });
    }
    if (unreadable) return EXIT.badInput;
    const results = compareCandidates(loaded.value, candidates, reference);
    const reasons = rankReasons(results);
    const bad = results.flatMap((c) => c.errors.map((e) => `${c.label}: ${e.message}`));
    if (bad.length) return fail(bad);
    const title = `Quick comparison over ${bandRange(loaded.value.bands.get('use')?.fromHz ?? 0, loaded.value.bands.get('use')?.toHz ?? 0)}`;
    t.stdout.write(
      args.flags.has('json') ? `${JSON.stringify(comparisonJson(title, reference, results), null, 2)}\n` : table(loaded.value, results, reasons, t),
    );
    return args.flags.has('strict') && results.some((c) => !c.pass) ? EXIT.limitFailed : EXIT.ok;
  },
};
