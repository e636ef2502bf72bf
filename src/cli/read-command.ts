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

/** Whether bytes src[a…a+n) are a JSON number: -?(0|[1-9][0-9]*)(.[0-9]+)?([eE][+-]?[0-9]+)? */
function isJsonNumber(src: Uint8Array, a: number, n: number): boolean {
  let i = a;
  const end = a + n;
  const digit = (c: number) => c >= 48 && c <= 57;
  if (src[i] === 45) i++;
  if (i >= end || !digit(src[i])) return false;
  if (src[i] === 48) i++;
  else while (i < end && digit(src[i])) i++;
  if (i < end && src[i] === 46) {
    i++;
    if (i >= end || !digit(src[i])) return false;
    while (i < end && digit(src[i])) i++;
  }
  if (i < end && (src[i] === 101 || src[i] === 69)) {
    i++;
    if (i < end && (src[i] === 43 || src[i] === 45)) i++;
    if (i >= end || !digit(src[i])) return false;
    while (i < end && digit(src[i])) i++;
  }
  return i === end;
}

/**
 * The S array of `read --json` from the file's own text: an S-parameter file
 * in RI format holds every value exactly as the JSON needs it (the reader
 * converts each decimal text exactly), so each number's bytes are copied as
 * written, where they are a JSON number (else, and for −0, it is formatted).
 * Formatting 640,000 doubles costs more than reading the file; one pass
 * writes into a buffer sized for the worst case, returned as bytes.
 */
function sJsonFromText(data: TouchstoneData, text: { source: Uint8Array; tokens: Float64Array }): Uint8Array {
  const net = data.network;
  const n = net.ports,
    k = net.freqHz.length;
  const { source, tokens } = text;
  const s = net.s;
  // at most: every token's bytes (or 24 for a formatted double), plus per point "[" "]" and a comma,
  // per row "[" "]" and a comma, per entry "[" "," "]" and a comma
  let size = k * (3 + n * (3 + n * 4));
  for (let p = 0; p < s.length; p++) size += Math.max(tokens[p] % 64, 24);
  const out = new Uint8Array(size);
  let w = 0;
  for (let q = 0; q < k; q++) {
    if (q) out[w++] = 44;
    out[w++] = 91;
    for (let i = 0; i < n; i++) {
      if (i) out[w++] = 44;
      out[w++] = 91;
      for (let j = 0; j < n; j++) {
        if (j) out[w++] = 44;
        out[w++] = 91;
        for (let part = 0; part < 2; part++) {
          const p = 2 * ((q * n + i) * n + j) + part;
          if (part) out[w++] = 44;
          const t = tokens[p];
          const a = Math.floor(t / 64),
            len = t % 64;
          if (len > 0 && !(s[p] === 0 && source[a] === 45) && isJsonNumber(source, a, len)) {
            for (let c = 0; c < len; c++) out[w + c] = source[a + c];
            w += len;
          } else {
            const f = jsonNumber(s[p]);
            for (let c = 0; c < f.length; c++) out[w++] = f.charCodeAt(c);
          }
        }
        out[w++] = 93;
      }
      out[w++] = 93;
    }
    out[w++] = 93;
  }
  return out.subarray(0, w);
}

/** The JSON of `read --json` in pieces to write one after another (no object per value); with the file's text, S values are copied as written (sJsonFromText), as bytes. */
function readJson(data: TouchstoneData, text?: { source: Uint8Array; tokens: Float64Array }): Array<string | Uint8Array> {
  const net = data.network;
  const n = net.ports;
  const k = net.freqHz.length;
  const parts: Array<string | Uint8Array> = [];
  // mixedModeOrder names the rows' modes, in the order of the matrix and of referenceOhms (null: single-ended ports 1…n)
  parts.push(
    `{"ports":${n},"version":${JSON.stringify(data.info.version)},"parameter":${JSON.stringify(data.info.parameter)},"mixedModeOrder":${JSON.stringify(data.info.mixedModeOrder)},`,
  );
  parts.push(`"frequencyHz":[${Array.from(net.freqHz, jsonNumber).join(',')}],`);
  parts.push(`"referenceOhms":[${Array.from(net.z0, jsonNumber).join(',')}],"s":[`);
  const asWritten = text && data.info.parameter === 'S' && data.info.format === 'RI' && text.tokens.length === net.s.length;
  if (asWritten) parts.push(sJsonFromText(data, text));
  for (let q = 0; q < (asWritten ? 0 : k); q++) {
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
  return parts;
}

export function readSummary(name: string, data: TouchstoneData, t: Terminal): string {
  const p = painter(t.stdout, t.env);
  const net = data.network;
  const k = net.freqHz.length;
  const info = data.info;
  const lines: string[] = [];
  const row = (label: string, text: string) => lines.push(`${label.padEnd(13)}${text}`);
  lines.push(p.bold(printable(name)));
  row(
    'format',
    `Touchstone ${info.version}, ${info.parameter}-parameters as ${info.format}, frequencies in ${info.frequencyUnit}${info.parameter !== 'S' ? ' (converted to S)' : ''}`,
  );
  row('ports', String(net.ports) + (info.mixedModeOrder ? `, in mixed-mode order: the rows are the modes ${info.mixedModeOrder.join(' ')}` : ''));
  row('points', `${k}, ${formatFrequency(net.freqHz[0])} to ${formatFrequency(net.freqHz[k - 1])}`);
  const uniform = net.z0.every((r) => r === net.z0[0]);
  // a file in mixed-mode order holds a mode per row (D1,2 differential, C1,2 common, S3 single-ended), each with its own reference
  const modes = info.mixedModeOrder;
  const rowName = (i: number) => (modes ? `mode ${modes[i]}` : `port ${i + 1}`);
  row(
    'reference',
    uniform ? `${trimNumber(net.z0[0])} Ω on every ${modes ? 'mode' : 'port'}` : Array.from(net.z0, (r, i) => `${rowName(i)}: ${trimNumber(r)} Ω`).join(', '),
  );
  if (data.noise) {
    const f = data.noise.freqHz;
    row('noise', `${f.length} points, ${formatFrequency(f[0])} to ${formatFrequency(f[f.length - 1])}`);
  }
  const pas = passivity(net);
  row(
    'passivity',
    `largest singular value ${trimNumber(pas.max, 5)} at ${formatFrequency(pas.atHz)}: ` +
      (pas.passive
        ? p.green('passive') + ' (≤ 1 + 1e-3)'
        : p.yellow('not passive') + ' (expected of an active part such as an amplifier; a fault in the data of a passive one)'),
  );
  if (net.ports > 1) {
    const rec = reciprocity(net);
    const where = rec.pair ? ` (S${rec.pair[0]}${rec.pair[1]} vs S${rec.pair[1]}${rec.pair[0]} at ${formatFrequency(rec.atHz)})` : '';
    row(
      'reciprocity',
      `largest |Sij − Sji| ${trimNumber(rec.maxDeviation, 3)}${where}: ${rec.reciprocal ? p.green('reciprocal') + ' (≤ 1e-3)' : p.yellow('not reciprocal') + ' (> 1e-3)'}`,
    );
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
    const json = args.flags.has('json');
    const result = readTouchstoneFile(resolve(t.cwd, file), { ports, keepText: json, hash: false });
    for (const w of result.warnings) t.stderr.write(`${formatDiagnostic(file, w, 'warning')}\n`);
    if (!result.value) {
      for (const e of result.errors) t.stderr.write(`${formatDiagnostic(file, e, 'error')}\n`);
      return EXIT.badInput;
    }
    if (!json) t.stdout.write(readSummary(file, result.value, t));
    else {
      // the S array goes out as the bytes it was copied into (a latin1 string of 15 MB would be encoded again)
      for (const piece of readJson(result.value, result.text)) t.stdout.write(piece);
    }
    return EXIT.ok;
  },
};
