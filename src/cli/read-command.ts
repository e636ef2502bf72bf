/**
 * `scatterbook read FILE [--json]`: what a Touchstone file holds, and whether
 * its data look physical.
 */
import { readTouchstoneFile } from '../io/touchstone-file.js';
import { ieee370Quality } from '../network/ieee370.js';
import { passivity, reciprocity } from '../network/quality.js';
import { formatDiagnostic } from '../touchstone/diagnostics.js';
import type { TouchstoneData } from '../touchstone/normalize.js';
import { printable } from '../format/escape.js';
import { formatFrequency, trimNumber } from '../format/units.js';
import { parseArgs, UsageError, type FlagSpec } from './args.js';
import { EXIT, type Command } from './command.js';
import { painter, type Terminal } from './terminal.js';
import { resolve } from 'node:path';

const FLAGS: FlagSpec[] = [
  { name: 'json', help: 'print the data as JSON on stdout' },
  { name: 'ports', value: true, help: 'port count of a version 1 file whose name has no .sNp extension' },
];

function jsonNumber(v: number): string {
  return Number.isFinite(v) ? String(v) : 'null';
}

/** The JSON of `read --json`, written directly (no object per value). */
export function readJson(data: TouchstoneData): string {
  const net = data.network;
  const n = net.ports;
  const k = net.freqHz.length;
  const parts: string[] = [];
  parts.push(`{"ports":${n},"version":${JSON.stringify(data.info.version)},"parameter":${JSON.stringify(data.info.parameter)},`);
  parts.push(`"frequencyHz":[${Array.from(net.freqHz, jsonNumber).join(',')}],`);
  parts.push(`"referenceOhms":[${Array.from(net.z0, jsonNumber).join(',')}],"s":[`);
  for (let q = 0; q < k; q++) {
    const rows: string[] = [];
    for (let i = 0; i < n; i++) {
      const cells: string[] = [];
      for (let j = 0; j < n; j++) {
        const p = 2 * ((q * n + i) * n + j);
        cells.push(`[${jsonNumber(net.s[p])},${jsonNumber(net.s[p + 1])}]`);
      }
      rows.push(`[${cells.join(',')}]`);
    }
    parts.push(`${q ? ',' : ''}[${rows.join(',')}]`);
  }
  parts.push('],"noise":');
  const nz = data.noise;
  if (!nz) parts.push('null');
  else {
    const g: string[] = [];
    for (let q = 0; q < nz.freqHz.length; q++) g.push(`[${jsonNumber(nz.gammaOpt[2 * q])},${jsonNumber(nz.gammaOpt[2 * q + 1])}]`);
    parts.push(
      `{"frequencyHz":[${Array.from(nz.freqHz, jsonNumber).join(',')}],"nfMinDb":[${Array.from(nz.nfMinDb, jsonNumber).join(',')}],"gammaOpt":[${g.join(',')}],"rnOhms":[${Array.from(nz.rnOhms, jsonNumber).join(',')}]}`,
    );
  }
  parts.push('}\n');
  return parts.join('');
}

export function readSummary(name: string, data: TouchstoneData, t: Terminal): string {
  const p = painter(t.stdout, t.env);
  const net = data.network;
  const k = net.freqHz.length;
  const info = data.info;
  const lines: string[] = [];
  const row = (label: string, text: string) => lines.push(`${label.padEnd(13)}${text}`);
  lines.push(p.bold(printable(name)));
  row('format', `Touchstone ${info.version}, ${info.parameter}-parameters as ${info.format}, frequencies in ${info.frequencyUnit}${info.parameter !== 'S' ? ' (converted to S)' : ''}`);
  row('ports', String(net.ports) + (info.mixedModeOrder ? `, mixed-mode order ${info.mixedModeOrder.join(' ')}` : ''));
  row('points', `${k}, ${formatFrequency(net.freqHz[0])} to ${formatFrequency(net.freqHz[k - 1])}`);
  const uniform = net.z0.every((r) => r === net.z0[0]);
  row('reference', uniform ? `${trimNumber(net.z0[0])} Ω on every port` : Array.from(net.z0, (r, i) => `port ${i + 1}: ${trimNumber(r)} Ω`).join(', '));
  if (data.noise) {
    const f = data.noise.freqHz;
    row('noise', `${f.length} points, ${formatFrequency(f[0])} to ${formatFrequency(f[f.length - 1])}`);
  }
  const pas = passivity(net);
  row(
    'passivity',
    `largest singular value ${trimNumber(pas.max, 5)} at ${formatFrequency(pas.atHz)}: ` +
      (pas.passive ? p.green('passive') + ' (≤ 1 + 1e-3)' : p.yellow('not passive') + ' (expected of an active part such as an amplifier; a fault in the data of a passive one)'),
  );
  if (net.ports > 1) {
    const rec = reciprocity(net);
    const where = rec.pair ? ` (S${rec.pair[0]}${rec.pair[1]} vs S${rec.pair[1]}${rec.pair[0]} at ${formatFrequency(rec.atHz)})` : '';
    row('reciprocity', `largest |Sij − Sji| ${trimNumber(rec.maxDeviation, 3)}${where}: ${rec.reciprocal ? p.green('reciprocal') + ' (≤ 1e-3)' : p.yellow('not reciprocal') + ' (> 1e-3)'}`);
  } else {
    row('reciprocity', 'does not apply to a 1-port');
  }
  const q = ieee370Quality(net, pas.perFrequency); // the singular values once, for both
  const metric = (m: { score: number; grade: string } | null) => (m ? `${trimNumber(m.score, 4)} (${m.grade})` : 'n/a');
  row('IEEE 370', `passivity ${metric(q.passivity)}, reciprocity ${metric(q.reciprocity)}, causality ${metric(q.causality)}`);
  return lines.join('\n') + '\n';
}

export const readCommand: Command = {
  name: 'read',
  usage: 'scatterbook read FILE [--json] [--ports N]',
  flags: FLAGS,
  run(argv, t) {
    const args = parseArgs(argv, FLAGS);
    if (args.positionals.length !== 1) throw new UsageError('read takes exactly one Touchstone file');
    const portsFlag = args.flags.get('ports');
    let ports: number | undefined;
    if (typeof portsFlag === 'string') {
      ports = Number(portsFlag);
      if (!Number.isInteger(ports) || ports < 1) throw new UsageError(`--ports needs a whole number ≥ 1, got "${portsFlag}"`);
    }
    const file = args.positionals[0];
    const result = readTouchstoneFile(resolve(t.cwd, file), { ports });
    for (const w of result.warnings) t.stderr.write(`${formatDiagnostic(file, w, 'warning')}\n`);
    if (!result.value) {
      for (const e of result.errors) t.stderr.write(`${formatDiagnostic(file, e, 'error')}\n`);
      return EXIT.badInput;
    }
    t.stdout.write(args.flags.has('json') ? readJson(result.value) : readSummary(file, result.value, t));
    return EXIT.ok;
  },
};
