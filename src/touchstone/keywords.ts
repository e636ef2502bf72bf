/**
 * Version 2 keywords ([Version], [Number of Ports], …): each line is checked
 * and its value stored in the header state; the parser acts on the returned
 * kind. Keywords are case-insensitive and blanks inside the brackets are
 * folded.
 */
import { fail } from './diagnostics.js';
import { tokenize } from './options.js';
import type { MatrixFormat, TwoPortOrder, Version } from './types.js';

export interface HeaderState {
  version: Version | null;
  ports: number | null;
  twoPortOrder: TwoPortOrder | null;
  frequencies: number | null;
  noiseFrequencies: number | null;
  reference: number[] | null;
  referenceLine: number;
  matrixFormat: MatrixFormat | null;
  mixedModeOrder: string[] | null;
  /** [Reference] is waiting for values on the following lines. */
  pendingReference: boolean;
}

export type KeywordAction = 'header' | 'information' | 'network-data' | 'noise-data' | 'end';

export const KEYWORDS = [
  '[Version]',
  '[Number of Ports]',
  '[Two-Port Data Order]',
  '[Number of Frequencies]',
  '[Number of Noise Frequencies]',
  '[Reference]',
  '[Matrix Format]',
  '[Mixed-Mode Order]',
  '[Begin Information]',
  '[End Information]',
  '[Network Data]',
  '[Noise Data]',
  '[End]',
] as const;

function positiveInteger(rest: string, name: string, line: number): number {
  if (!/^\d+$/.test(rest) || Number(rest) < 1) fail('keyword-value', line, `[${name}] needs a whole number ≥ 1, got "${rest}"`);
  return Number(rest);
}

function once<T>(current: T | null, name: string, line: number): void {
  if (current !== null) fail('keyword-order', line, `[${name}] is given twice; expected it once`);
}

export function parseKeyword(text: string, line: number, h: HeaderState, phase: string): KeywordAction {
  const m = /^\[([^\]]*)\](.*)$/.exec(text);
  if (!m) fail('unknown-keyword', line, `"${text}" opens a keyword with "[" but never closes it with "]"`);
  const key = m[1].trim().replace(/\s+/g, ' ').toLowerCase();
  const rest = m[2].trim();
  const restColumn = text.indexOf(']') + 2;
  switch (key) {
    case 'version': {
      if (h.version !== null) fail('keyword-order', line, '[Version] is given twice; it opens a version 2 file once');
      if (!/^\d+(\.\d+)?$/.test(rest) || (Number(rest) !== 2 && Number(rest) !== 2.1)) {
        fail('version', line, `[Version] "${rest}" is not a version scatterbook reads; expected 2.0 or 2.1`);
      }
      h.version = Number(rest) === 2.1 ? '2.1' : '2.0';
      return 'header';
    }
    case 'number of ports':
      once(h.ports, 'Number of Ports', line);
      h.ports = positiveInteger(rest, 'Number of Ports', line);
      return 'header';
    case 'two-port data order':
      once(h.twoPortOrder, 'Two-Port Data Order', line);
      if (rest !== '12_21' && rest !== '21_12') fail('keyword-value', line, `[Two-Port Data Order] "${rest}" must be 12_21 or 21_12`);
      h.twoPortOrder = rest;
      return 'header';
    case 'number of frequencies':
      once(h.frequencies, 'Number of Frequencies', line);
      h.frequencies = positiveInteger(rest, 'Number of Frequencies', line);
      return 'header';
    case 'number of noise frequencies':
      once(h.noiseFrequencies, 'Number of Noise Frequencies', line);
      h.noiseFrequencies = positiveInteger(rest, 'Number of Noise Frequencies', line);
      return 'header';
    case 'reference': {
      once(h.reference, 'Reference', line);
      if (h.ports === null) fail('keyword-order', line, '[Reference] must follow [Number of Ports] (it holds one value per port)');
      const values: number[] = [];
      for (const t of tokenize(rest, restColumn)) {
        const v = Number(t.text);
        if (!/^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/.test(t.text))
          fail('keyword-value', line, `"${t.text}" in [Reference] is not a number; expected one reference resistance in ohms per port`, t.column);
        if (!(v > 0) || !Number.isFinite(v)) fail('keyword-value', line, `[Reference] value ${t.text} must be a positive number of ohms`, t.column);
        values.push(v);
      }
      if (values.length > h.ports) fail('keyword-value', line, `[Reference] holds ${values.length} values for ${h.ports} ports; expected one per port`);
      h.reference = values;
      h.referenceLine = line;
      h.pendingReference = values.length < h.ports;
      return 'header';
    }
    case 'matrix format': {
      once(h.matrixFormat, 'Matrix Format', line);
      const v = rest.toLowerCase();
      if (v !== 'full' && v !== 'lower' && v !== 'upper') fail('keyword-value', line, `[Matrix Format] "${rest}" must be Full, Lower or Upper`);
      h.matrixFormat = v;
      return 'header';
    }
    case 'mixed-mode order': {
      once(h.mixedModeOrder, 'Mixed-Mode Order', line);
      if (h.ports === null) fail('keyword-order', line, '[Mixed-Mode Order] must follow [Number of Ports]');
      const tokens = tokenize(rest, restColumn);
      for (const t of tokens) {
        if (!/^([DC]\d+,\d+|S\d+)$/i.test(t.text))
          fail('keyword-value', line, `"${t.text}" in [Mixed-Mode Order] is not a mode descriptor; expected Da,b, Ca,b or Sa (e.g. D1,2 C1,2 S3)`, t.column);
      }
      if (tokens.length !== h.ports)
        fail('keyword-value', line, `[Mixed-Mode Order] lists ${tokens.length} descriptors for ${h.ports} ports; expected one per port`);
      h.mixedModeOrder = tokens.map((t) => t.text.toUpperCase());
      return 'header';
    }
    case 'begin information':
      return 'information';
    case 'end information':
      fail('keyword-order', line, '[End Information] without [Begin Information]');
    // unreachable: fail throws
    case 'network data':
      if (phase !== 'header') fail('keyword-order', line, '[Network Data] is given twice');
      return 'network-data';
    case 'noise data':
      if (phase !== 'network' && phase !== 'between') fail('keyword-order', line, '[Noise Data] must follow the network data');
      return 'noise-data';
    case 'end':
      return 'end';
    default:
      fail('unknown-keyword', line, `unknown keyword [${m[1].trim()}]; expected one of ${KEYWORDS.join(' ')}`);
  }
}
