/**
 * `scatterbook figures PART.yaml [--json] [--strict]`: every figure of a part
 * over every unit, checked against its limits, with where the worst sits.
 */
import { dirname, resolve } from 'node:path';
import type { CheckResult, PartResult } from '../evaluate/evaluate.js';
import { figuresJson } from '../evaluate/json.js';
import { printable } from '../format/escape.js';
import { coarsestResolutionHz, formatFrequency } from '../format/units.js';
import { formatLimit, formatStages, formatValue } from '../format/values.js';
import { evaluatePartFile } from '../pipeline/part.js';
import { formatSpecError } from '../part-file/diagnostics.js';
import { parseArgs, UsageError, type FlagSpec } from './args.js';
import { EXIT, type Command } from './command.js';
import { painter, type Painter, type Terminal } from './terminal.js';

const FLAGS: FlagSpec[] = [
  { name: 'json', help: 'print the results as JSON on stdout' },
  { name: 'strict', help: 'exit 3 when a limit fails' },
];

function verdict(c: CheckResult, p: Painter): string {
  if (c.pass === null) return 'report';
  return c.pass ? p.green('PASS') : p.red('FAIL');
}

/** Pads to a width measured in characters that show (colour codes excluded). */
function pad(s: string, width: number): string {
  const visible = s.replace(/\x1b\[[0-9;]*m/g, '').length;
  return s + ' '.repeat(Math.max(0, width - visible));
}

export function figuresTable(r: PartResult, p: Painter, resolutionHz: number | null = null): string {
  const head = ['figure', 'on', 'band', 'limit', 'typical', 'worst', 'at', 'margin', ''];
  const rows = r.results.map((c) => [
    printable(c.change ? `${c.label} (${formatStages(c.change)})` : c.label),
    printable(c.on.join(' ')),
    printable(c.band),
    formatLimit(c.limit, c.unit),
    formatValue(c.typical, c.unit, resolutionHz),
    `${formatValue(c.worst, c.unit, resolutionHz)} (${printable(c.worstUnit)})`,
    c.worstAtHz === null ? '—' : formatFrequency(c.worstAtHz),
    c.margin === null ? '—' : formatValue(c.margin, c.unit, resolutionHz),
    verdict(c, p),
  ]);
  const widths = head.map((h, i) => Math.max(h.length, ...rows.map((row) => row[i].replace(/\x1b\[[0-9;]*m/g, '').length)));
  const line = (cells: string[]) =>
    cells
      .map((c, i) => pad(c, widths[i]))
      .join('  ')
      .trimEnd();
  const total = r.pass ? p.green('PASS') : p.red('FAIL');
  return [`${p.bold(printable(r.part))} revision ${printable(r.revision) || '—'}: ${total}`, '', p.bold(line(head)), ...rows.map(line)].join('\n') + '\n';
}

export const figuresCommand: Command = {
  name: 'figures',
  usage: 'scatterbook figures PART.yaml [--json] [--strict]',
  flags: FLAGS,
  async run(argv, t: Terminal) {
    const args = parseArgs(argv, FLAGS);
    if (args.positionals.length !== 1) throw new UsageError('figures takes exactly one part file');
    const file = args.positionals[0];
    const path = resolve(t.cwd, file);
    const outcome = await evaluatePartFile(path, dirname(path), file);
    if (!outcome.result) {
      for (const e of outcome.errors) t.stderr.write(`${formatSpecError(e, e.file === file ? outcome.source : undefined)}\n`);
      return EXIT.badInput;
    }
    const r = outcome.result;
    for (const w of r.warnings) t.stderr.write(`${formatSpecError(w, w.file === file ? outcome.source : undefined, 'warning')}\n`);
    const res = coarsestResolutionHz(outcome.units.map((u) => u.network.freqHz));
    t.stdout.write(args.flags.has('json') ? `${JSON.stringify(figuresJson(r), null, 2)}\n` : figuresTable(r, painter(t.stdout, t.env), res));
    return !r.pass && args.flags.has('strict') ? EXIT.limitFailed : EXIT.ok;
  },
};
