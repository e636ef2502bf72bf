/**
 * TouchstoneRecord (as written) → Network (Hz, complex S at per-port real
 * references) plus noise parameters in absolute units.
 *
 * Y/Z/H/G data are converted to S at the file's references:
 *   version 1: values are normalized to R (z = Z/R, y = Y·R, h11 = H11/R,
 *     h22 = H22·R, h12 and h21 unitless; g likewise), so S follows from the
 *     normalized matrix directly;
 *   version 2: Y/Z (and H/G) are absolute ohms and siemens, normalized here
 *     per port (z = R^−½ Z R^−½, y = √R Y √R) before the same step.
 * A mixed-mode file's references follow Touchstone 2.0: a differential port
 * Da,b sees Ra + Rb, a common port Ca,b sees Ra·Rb/(Ra + Rb), Sa sees Ra.
 */
import { yNormalizedToSInPlace, zNormalizedToSInPlace } from '../network/convert.js';
import { makeNetwork, type Network } from '../network/network.js';
import { gNormalizedToSInPlace, hNormalizedToSInPlace, hybridNormalization } from '../network/twoport.js';
import type { DataFormat, FrequencyUnit, MatrixFormat, Parameter, TouchstoneRecord, TwoPortOrder, Version } from './types.js';

export interface NoiseParameters {
  readonly freqHz: Float64Array;
  readonly nfMinDb: Float64Array;
  /** Γopt, interleaved re/im. */
  readonly gammaOpt: Float64Array;
  readonly rnOhms: Float64Array;
}

/** What a file said about itself, kept beside the network. */
export interface TouchstoneInfo {
  readonly version: Version;
  readonly parameter: Parameter;
  readonly format: DataFormat;
  readonly frequencyUnit: FrequencyUnit;
  readonly matrixFormat: MatrixFormat;
  readonly twoPortOrder: TwoPortOrder | null;
  /** Single-ended references as the file gave them. */
  readonly fileReferenceOhms: readonly number[];
  readonly mixedModeOrder: readonly string[] | null;
  readonly comments: readonly string[];
  readonly information: readonly string[];
}

export interface TouchstoneData {
  readonly network: Network;
  readonly noise: NoiseParameters | null;
  readonly info: TouchstoneInfo;
}

/** Converts value pairs in DB or MA format to re/im, in place. */
export function toRealImagInPlace(values: Float64Array, format: DataFormat): void {
  if (format === 'RI') return;
  const deg = Math.PI / 180;
  for (let i = 0; i < values.length; i += 2) {
    const m = format === 'DB' ? Math.pow(10, values[i] / 20) : values[i];
    const a = values[i + 1] * deg;
    values[i] = m * Math.cos(a);
    values[i + 1] = m * Math.sin(a);
  }
}

/** Per logical port reference of a mixed-mode file. */
export function mixedModeReferences(order: readonly string[], singleEnded: readonly number[]): Float64Array {
  return Float64Array.from(order, (d) => {
    const m = /^([DCS])(\d+)(?:,(\d+))?$/.exec(d) as RegExpExecArray;
    const ra = singleEnded[Number(m[2]) - 1] ?? singleEnded[0];
    if (m[1] === 'S') return ra;
    const rb = singleEnded[Number(m[3]) - 1] ?? singleEnded[0];
    return m[1] === 'D' ? ra + rb : (ra * rb) / (ra + rb);
  });
}

/**
 * Builds the network. With `reuse`, the record's value array becomes the S
 * storage (no copy); the record must not be used afterwards.
 */
export function toNetwork(record: TouchstoneRecord, reuse = false): TouchstoneData {
  const n = record.ports;
  const data = reuse ? record.values : record.values.slice();
  toRealImagInPlace(data, record.options.format);
  const z0 = record.mixedModeOrder ? mixedModeReferences(record.mixedModeOrder, record.referenceOhms) : Float64Array.from(record.referenceOhms);
  const v1 = record.version === '1.1';
  switch (record.options.parameter) {
    case 'S':
      break;
    case 'Z':
      if (!v1) scaleEntries(data, n, (i, j) => 1 / Math.sqrt(z0[i] * z0[j]));
      zNormalizedToSInPlace(data, n);
      break;
    case 'Y':
      if (!v1) scaleEntries(data, n, (i, j) => Math.sqrt(z0[i] * z0[j]));
      yNormalizedToSInPlace(data, n);
      break;
    case 'H':
    case 'G': {
      if (!v1) {
        const f = hybridNormalization(record.options.parameter, z0[0], z0[1]);
        scaleEntries(data, 2, (i, j) => f[2 * i + j]);
      }
      if (record.options.parameter === 'H') hNormalizedToSInPlace(data);
      else gNormalizedToSInPlace(data);
      break;
    }
  }
  const network = makeNetwork(record.freqHz, z0, data, n);
  return { network, noise: record.noise ? noiseOf(record) : null, info: infoOf(record) };
}

function scaleEntries(data: Float64Array, n: number, f: (i: number, j: number) => number): void {
  const w = new Float64Array(n * n);
  for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) w[i * n + j] = f(i, j);
  const size = 2 * n * n;
  for (let off = 0; off < data.length; off += size) {
    for (let e = 0; e < n * n; e++) {
      data[off + 2 * e] *= w[e];
      data[off + 2 * e + 1] *= w[e];
    }
  }
}

function noiseOf(record: TouchstoneRecord): NoiseParameters {
  const nz = record.noise as NonNullable<TouchstoneRecord['noise']>;
  const k = nz.freqHz.length;
  const gamma = new Float64Array(2 * k);
  const deg = Math.PI / 180;
  for (let q = 0; q < k; q++) {
    gamma[2 * q] = nz.gammaOptMag[q] * Math.cos(nz.gammaOptDeg[q] * deg);
    gamma[2 * q + 1] = nz.gammaOptMag[q] * Math.sin(nz.gammaOptDeg[q] * deg);
  }
  const r = record.referenceOhms[0];
  const rnOhms = record.version === '1.1' ? nz.rn.map((v) => v * r) : nz.rn.slice();
  return { freqHz: nz.freqHz, nfMinDb: nz.nfMinDb, gammaOpt: gamma, rnOhms };
}

function infoOf(record: TouchstoneRecord): TouchstoneInfo {
  return {
    version: record.version,
    parameter: record.options.parameter,
    format: record.options.format,
    frequencyUnit: record.options.frequencyUnit,
    matrixFormat: record.matrixFormat,
    twoPortOrder: record.twoPortOrder,
    fileReferenceOhms: record.referenceOhms,
    mixedModeOrder: record.mixedModeOrder,
    comments: record.comments,
    information: record.information,
  };
}
