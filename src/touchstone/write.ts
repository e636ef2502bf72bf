/**
 * Network → Touchstone text, version 1.1, 2.0 or 2.1, in any parameter,
 * format and frequency unit. Numbers are written as the shortest decimal that
 * reads back to the same double, and frequencies are scaled to the chosen
 * unit by moving the decimal point in that text, so that reading the file
 * back returns the very same frequencies.
 */
import { sToY, sToZ } from '../network/convert.js';
import type { Network } from '../network/network.js';
import { hybridNormalization, sToGNormalized, sToHNormalized } from '../network/twoport.js';
import { entryOrder } from './layout.js';
import type { NoiseParameters } from './normalize.js';
import { FREQUENCY_EXPONENT, type DataFormat, type FrequencyUnit, type MatrixFormat, type Parameter, type TwoPortOrder, type Version } from './types.js';

export interface WriteOptions {
  readonly version?: Version;
  readonly parameter?: Parameter;
  readonly format?: DataFormat;
  readonly frequencyUnit?: FrequencyUnit;
  /** Version 2 only; Lower and Upper suit reciprocal data (the other half is not written). */
  readonly matrixFormat?: MatrixFormat;
  /** Version 2 2-ports only; version 1 is always 21_12. */
  readonly twoPortOrder?: TwoPortOrder;
  /** Comment lines written at the top (without "!"). */
  readonly comments?: readonly string[];
  readonly noise?: NoiseParameters | null;
  /**
   * Significant digits of the data values (frequencies are always exact).
   * Default: as many as a double needs to read back unchanged.
   */
  readonly significantDigits?: number;
}

export class TouchstoneWriteError extends Error {}

/** Text of x / 10^pow, exact (the decimal point of x's shortest form is moved). */
export function shiftDecimal(x: number, pow: number): string {
  if (pow === 0 || x === 0) return String(x);
  const text = String(x);
  const sign = text.startsWith('-') ? '-' : '';
  const [mant, expText] = text.replace('-', '').split('e');
  const [intPart, fracPart = ''] = mant.split('.');
  const all = intPart + fracPart;
  const lead = all.length - all.replace(/^0+/, '').length;
  const digits = all.slice(lead).replace(/0+$/, '');
  // value = 0.digits × 10^point
  const point = intPart.length - lead + Number(expText ?? 0) - pow;
  let out: string;
  if (point > 21 || point < -6) out = `${digits[0]}${digits.length > 1 ? '.' + digits.slice(1) : ''}e${point - 1}`;
  else if (point <= 0) out = `0.${'0'.repeat(-point)}${digits}`;
  else if (point >= digits.length) out = digits + '0'.repeat(point - digits.length);
  else out = `${digits.slice(0, point)}.${digits.slice(point)}`;
  return sign + out;
}

type NumberText = (v: number) => string;

/** Shortest round-trip text, or `digits` significant digits; never NaN or ∞. */
function numberText(digits?: number): NumberText {
  return (v) => {
    if (!Number.isFinite(v)) throw new TouchstoneWriteError(`cannot write ${v}: Touchstone holds finite numbers only`);
    if (v === 0) return '0';
    return digits === undefined ? String(v) : String(Number(v.toPrecision(digits)));
  };
}

const exact = numberText();

/** Smallest dB value written for an exact zero (|S| = 1e−50). */
const ZERO_DB = -1000;

function pairText(re: number, im: number, format: DataFormat, num: NumberText): string {
  if (format === 'RI') return `${num(re)} ${num(im)}`;
  const mag = Math.hypot(re, im);
  const ang = mag === 0 ? 0 : (Math.atan2(im, re) * 180) / Math.PI;
  if (format === 'MA') return `${num(mag)} ${num(ang)}`;
  return `${num(mag === 0 ? ZERO_DB : 20 * Math.log10(mag))} ${num(ang)}`;
}

/** The matrices to write, in the chosen parameter and the normalization the version asks for. */
function parameterData(net: Network, parameter: Parameter, v1: boolean): Float64Array {
  const r = net.z0;
  const n = net.ports;
  switch (parameter) {
    case 'S':
      return net.s;
    case 'Z':
    case 'Y': {
      const m = parameter === 'Z' ? sToZ(net).data : sToY(net).data;
      if (v1) {
        const f = parameter === 'Z' ? 1 / r[0] : r[0];
        for (let i = 0; i < m.length; i++) m[i] *= f;
      }
      return m;
    }
    case 'H':
    case 'G': {
      if (n !== 2) throw new TouchstoneWriteError(`${parameter}-parameters are defined for 2-ports only; this network has ${n} ports`);
      const m = parameter === 'H' ? sToHNormalized(net.s) : sToGNormalized(net.s);
      if (!v1) {
        const f = hybridNormalization(parameter, r[0], r[1]);
        for (let off = 0; off < m.length; off += 8) {
          for (let e = 0; e < 4; e++) {
            m[off + 2 * e] /= f[e];
            m[off + 2 * e + 1] /= f[e];
          }
        }
      }
      return m;
    }
  }
}

export function writeTouchstone(net: Network, options: WriteOptions = {}): string {
  const version = options.version ?? '1.1';
  const v1 = version === '1.1';
  const parameter = options.parameter ?? 'S';
  const format = options.format ?? 'RI';
  const unit = options.frequencyUnit ?? 'GHz';
  const matrixFormat = v1 ? 'full' : (options.matrixFormat ?? 'full');
  const n = net.ports;
  if (matrixFormat !== 'full' && (parameter === 'H' || parameter === 'G')) {
    throw new TouchstoneWriteError(
      `${parameter}-parameters are written Full: even for a reciprocal network the off-diagonal entries differ in sign (${parameter.toLowerCase()}12 = −${parameter.toLowerCase()}21)`,
    );
  }
  const order2 = v1 ? '21_12' : (options.twoPortOrder ?? '12_21');
  const uniform = net.z0.every((r) => r === net.z0[0]);
  if (v1 && !uniform) throw new TouchstoneWriteError('version 1 holds one reference impedance for all ports; write version 2, or renormalize first');
  const perPortR = version === '2.1' && !uniform;
  const noise = options.noise ?? null;
  if (noise && n !== 2) throw new TouchstoneWriteError('noise parameters belong to 2-ports only');
  const k = net.freqHz.length;
  if (v1 && noise && noise.freqHz.length > 0 && k > 0 && noise.freqHz[0] > net.freqHz[k - 1]) {
    throw new TouchstoneWriteError(
      'in version 1 the noise block must start at a frequency not above the last network frequency, or it would read as network data',
    );
  }
  const data = parameterData(net, parameter, v1);
  const num = numberText(options.significantDigits);
  const exp = FREQUENCY_EXPONENT[unit];
  const lines: string[] = [];
  for (const c of options.comments ?? []) lines.push(`! ${c}`.trimEnd());
  if (!v1) lines.push(`[Version] ${version}`);
  const rText = perPortR ? Array.from(net.z0, exact).join(' ') : exact(net.z0[0]);
  lines.push(`# ${unit.toUpperCase()} ${parameter} ${format} R ${rText}`);
  if (!v1) {
    lines.push(`[Number of Ports] ${n}`);
    if (n === 2) lines.push(`[Two-Port Data Order] ${order2}`);
    lines.push(`[Number of Frequencies] ${k}`);
    if (noise) lines.push(`[Number of Noise Frequencies] ${noise.freqHz.length}`);
    if (!uniform && !perPortR) lines.push(`[Reference] ${Array.from(net.z0, exact).join(' ')}`);
    if (matrixFormat !== 'full') lines.push(`[Matrix Format] ${matrixFormat === 'lower' ? 'Lower' : 'Upper'}`);
    lines.push('[Network Data]');
  }
  const order = entryOrder(n, matrixFormat, order2);
  // rows of the matrix, for the line layout: one line per point up to 2 ports,
  // one line per row from 3 ports, wrapped after 4 pairs from 5 ports (Touchstone 1.1).
  const stride = 2 * n * n;
  for (let q = 0; q < k; q++) {
    const off = q * stride;
    const f = shiftDecimal(net.freqHz[q], exp);
    if (n <= 2) {
      lines.push(`${f} ${order.map(([i, j]) => pairText(data[off + 2 * (i * n + j)], data[off + 2 * (i * n + j) + 1], format, num)).join(' ')}`);
      continue;
    }
    let row = -1;
    let inRow = 0;
    let current = f;
    for (const [i, j] of order) {
      if (i !== row) {
        if (row >= 0) {
          lines.push(current);
          current = '';
        }
        row = i;
        inRow = 0;
      } else if (inRow === 4) {
        lines.push(current);
        current = '';
        inRow = 0;
      }
      const p = pairText(data[off + 2 * (i * n + j)], data[off + 2 * (i * n + j) + 1], format, num);
      current = current ? `${current} ${p}` : `  ${p}`;
      inRow++;
    }
    lines.push(current);
  }
  if (noise) {
    if (!v1) lines.push('[Noise Data]');
    const r = net.z0[0];
    for (let q = 0; q < noise.freqHz.length; q++) {
      const re = noise.gammaOpt[2 * q],
        im = noise.gammaOpt[2 * q + 1];
      const mag = Math.hypot(re, im);
      const ang = mag === 0 ? 0 : (Math.atan2(im, re) * 180) / Math.PI;
      const rn = v1 ? noise.rnOhms[q] / r : noise.rnOhms[q];
      lines.push(`${shiftDecimal(noise.freqHz[q], exp)} ${num(noise.nfMinDb[q])} ${num(mag)} ${num(ang)} ${num(rn)}`);
    }
  }
  if (!v1) lines.push('[End]');
  return lines.join('\n') + '\n';
}
