/**
 * Property tests (fast-check): random networks written in every syntax variant
 * the standard allows read back equal; random and mutated bytes never crash
 * the reader.
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { makeNetwork, type Network } from '../../src/network/network.js';
import { readTouchstone, writeTouchstone, type WriteOptions } from '../../src/touchstone/index.js';
import type { NoiseParameters } from '../../src/touchstone/normalize.js';

interface Case {
  net: Network;
  noise: NoiseParameters | null;
  options: WriteOptions;
  symmetric: boolean;
}

const freqGrid = (k: number) =>
  fc
    .tuple(fc.double({ min: 0, max: 1e9, noNaN: true }), fc.array(fc.double({ min: 1, max: 1e8, noNaN: true }), { minLength: k, maxLength: k }))
    .map(([start, steps]) => {
      const f = new Float64Array(k);
      let acc = start;
      for (let q = 0; q < k; q++) f[q] = acc += steps[q];
      return f;
    });

const caseArb: fc.Arbitrary<Case> = fc
  .record({
    ports: fc.integer({ min: 1, max: 6 }),
    points: fc.integer({ min: 1, max: 8 }),
    symmetric: fc.boolean(),
    version: fc.constantFrom('1.1', '2.0', '2.1') as fc.Arbitrary<'1.1' | '2.0' | '2.1'>,
    perPort: fc.boolean(),
    parameter: fc.constantFrom('S', 'Y', 'Z', 'H', 'G') as fc.Arbitrary<'S' | 'Y' | 'Z' | 'H' | 'G'>,
    format: fc.constantFrom('RI', 'MA', 'DB') as fc.Arbitrary<'RI' | 'MA' | 'DB'>,
    unit: fc.constantFrom('Hz', 'kHz', 'MHz', 'GHz') as fc.Arbitrary<'Hz' | 'kHz' | 'MHz' | 'GHz'>,
    matrix: fc.constantFrom('full', 'lower', 'upper') as fc.Arbitrary<'full' | 'lower' | 'upper'>,
    order: fc.constantFrom('12_21', '21_12') as fc.Arbitrary<'12_21' | '21_12'>,
    withNoise: fc.boolean(),
    seed: fc.integer(),
  })
  .chain((p) =>
    fc.record({
      p: fc.constant(p),
      freq: freqGrid(p.points),
      values: fc.array(fc.double({ min: -1, max: 1, noNaN: true }), {
        minLength: 2 * p.ports * p.ports * p.points,
        maxLength: 2 * p.ports * p.ports * p.points,
      }),
      z0: fc.array(fc.double({ min: 1, max: 200, noNaN: true }), { minLength: p.ports, maxLength: p.ports }),
      noise: fc.array(fc.double({ min: 0, max: 0.95, noNaN: true }), { minLength: 8, maxLength: 8 }),
    }),
  )
  .map(({ p, freq, values, z0, noise }) => {
    const n = p.ports;
    const a = 0.7 / n; // keeps ‖S‖₂ < 1, so I ± S are invertible for the Y/Z/H/G forms
    const s = Float64Array.from(values, (v) => v * a);
    if (p.symmetric) {
      for (let k = 0; k < p.points; k++)
        for (let i = 0; i < n; i++)
          for (let j = 0; j < i; j++) {
            const lo = 2 * ((k * n + i) * n + j),
              hi = 2 * ((k * n + j) * n + i);
            s[hi] = s[lo];
            s[hi + 1] = s[lo + 1];
          }
    }
    const perPort = p.version !== '1.1' && p.perPort;
    const z = perPort ? Float64Array.from(z0) : new Float64Array(n).fill(z0[0]);
    const net = makeNetwork(freq, z, s, n);
    const parameter = (p.parameter === 'H' || p.parameter === 'G') && n !== 2 ? 'S' : p.parameter;
    const hasNoise = n === 2 && p.withNoise;
    let noiseData: NoiseParameters | null = null;
    if (hasNoise) {
      const nf = p.version === '1.1' ? Float64Array.of(freq[0], freq[0] + 1e6) : Float64Array.of(freq[p.points - 1] + 5, freq[p.points - 1] + 1e7);
      noiseData = {
        freqHz: nf,
        nfMinDb: Float64Array.of(noise[0] * 3, noise[1] * 3),
        gammaOpt: Float64Array.of(noise[2] * 0.7, noise[3] * 0.7, -noise[4] * 0.7, noise[5] * 0.1),
        rnOhms: Float64Array.of(1 + noise[6] * 40, 1 + noise[7] * 40), // Rn of real parts: ohms, not subnormal numbers
      };
    }
    const options: WriteOptions = {
      version: p.version,
      parameter,
      format: p.format,
      frequencyUnit: p.unit,
      matrixFormat: p.symmetric && parameter !== 'H' && parameter !== 'G' ? p.matrix : 'full',
      twoPortOrder: p.order,
      noise: noiseData,
      comments: ['written by the property test'],
    };
    return { net, noise: noiseData, options, symmetric: p.symmetric };
  });

/** Legal variations of the text: case, token order, blanks, comments, line ends. */
const variantArb = fc.record({
  upper: fc.boolean(),
  shuffle: fc.boolean(),
  tabs: fc.boolean(),
  comments: fc.boolean(),
  crlf: fc.boolean(),
  seed: fc.nat(),
});

interface Variant {
  upper: boolean;
  shuffle: boolean;
  tabs: boolean;
  comments: boolean;
  crlf: boolean;
  seed: number;
}

function vary(text: string, v: Variant): string {
  let rnd = v.seed || 1;
  const next = () => (rnd = (rnd * 1103515245 + 12345) & 0x7fffffff) / 0x7fffffff;
  const lines = text.split('\n').map((line) => {
    if (line.startsWith('#')) {
      const toks = line.slice(1).trim().split(/\s+/);
      const ri = toks.indexOf('R');
      const groups: string[][] = [];
      for (let i = 0; i < toks.length; i++) {
        if (i === ri) {
          const g = [toks[i]];
          while (i + 1 < toks.length && /^[\d.]/.test(toks[i + 1])) g.push(toks[++i]);
          groups.push(g);
        } else groups.push([toks[i]]);
      }
      if (v.shuffle) groups.sort(() => next() - 0.5);
      const body = groups.flat().join(' ');
      return `#${v.upper ? body.toLowerCase() : body}`;
    }
    if (line.startsWith('[') && v.upper) return line.replace(/^\[[^\]]*\]/, (k) => (next() < 0.5 ? k.toUpperCase() : k.toLowerCase()));
    if (v.tabs && !line.startsWith('!')) return line.replace(/ /g, () => (next() < 0.5 ? '\t' : '   '));
    return line;
  });
  const out: string[] = [];
  for (const l of lines) {
    if (v.comments && next() < 0.3) out.push('! an inserted comment [Version] # GHz 1 2 3');
    out.push(v.comments && l && !l.startsWith('!') && next() < 0.3 ? `${l} ! trailing` : l);
  }
  return out.join(v.crlf ? '\r\n' : '\n');
}

function fileName(c: Case): string {
  return c.options.version === '1.1' ? `p.s${c.net.ports}p` : 'p.ts';
}

describe('read(write(x)) = x', () => {
  it('for random networks in every version, parameter, format, unit, matrix format and syntax variant', () => {
    fc.assert(
      fc.property(caseArb, variantArb, (c, v) => {
        const text = vary(writeTouchstone(c.net, c.options), v);
        const r = readTouchstone(text, { fileName: fileName(c) });
        if (!r.value) throw new Error(`${JSON.stringify(r.errors)}\n${text}`);
        const got = r.value.network;
        expect(got.ports).toBe(c.net.ports);
        expect(Array.from(got.freqHz)).toEqual(Array.from(c.net.freqHz)); // exact: the decimal point is moved, not multiplied
        expect(Array.from(got.z0)).toEqual(Array.from(c.net.z0));
        const n = c.net.ports;
        const size = 2 * n * n;
        for (let off = 0; off < got.s.length; off += size) {
          let scale = 0;
          for (let i = 0; i < size; i++) scale = Math.max(scale, Math.abs(c.net.s[off + i]));
          // 1e-12 relative to the largest entry of the matrix at that frequency; Y/Z/H/G data come back
          // through (I ± S)⁻¹, whose round-off is relative to |I ± S| ≈ 1, so there the scale is at least 1.
          if (c.options.parameter !== 'S') scale = Math.max(scale, 1);
          // dB cannot hold an exact zero: the writer puts −1000 dB there, which reads back as 1e−50
          if (c.options.format === 'DB') scale = Math.max(scale, 1e-37);
          for (let i = 0; i < size; i++) {
            if (!(Math.abs(got.s[off + i] - c.net.s[off + i]) <= 1e-12 * scale)) {
              throw new Error(`value ${i} at offset ${off}: wrote ${c.net.s[off + i]}, read ${got.s[off + i]}\n${text}`);
            }
          }
        }
        if (c.noise) {
          const nz = r.value.noise;
          expect(nz).not.toBeNull();
          expect(Array.from(nz!.freqHz)).toEqual(Array.from(c.noise.freqHz));
          for (let i = 0; i < 2; i++) {
            expect(Math.abs(nz!.nfMinDb[i] - c.noise.nfMinDb[i])).toBeLessThanOrEqual(1e-12 * Math.abs(c.noise.nfMinDb[i]));
            expect(Math.abs(nz!.rnOhms[i] - c.noise.rnOhms[i])).toBeLessThanOrEqual(1e-12 * Math.abs(c.noise.rnOhms[i]));
            expect(Math.abs(nz!.gammaOpt[2 * i] - c.noise.gammaOpt[2 * i])).toBeLessThanOrEqual(1e-12);
          }
        } else expect(r.value.noise).toBeNull();
      }),
      { numRuns: 400 },
    );
  });

  it('a 64-port network', () => {
    const n = 64;
    const s = Float64Array.from({ length: 2 * n * n * 2 }, (_, i) => Math.sin(i) * 0.01);
    const net = makeNetwork(Float64Array.of(1e9, 2e9), 50, s, n);
    for (const version of ['1.1', '2.0'] as const) {
      const r = readTouchstone(writeTouchstone(net, { version, format: 'MA' }), { fileName: version === '1.1' ? 'big.s64p' : 'big.ts' });
      expect(r.errors).toEqual([]);
      let worst = 0;
      for (let i = 0; i < s.length; i++) worst = Math.max(worst, Math.abs(r.value!.network.s[i] - s[i]));
      expect(worst).toBeLessThan(1e-16);
    }
  });
});

const CODES = new Set([
  'not-text',
  'bad-number',
  'number-range',
  'value-count',
  'frequency-order',
  'duplicate-frequency',
  'missing-option-line',
  'unknown-option',
  'option-value',
  'negative-magnitude',
  'unknown-keyword',
  'keyword-value',
  'keyword-order',
  'missing-keyword',
  'frequency-count',
  'noise-count',
  'noise-data',
  'port-count',
  'parameter-ports',
  'version',
  'no-data',
]);

function checkOutcome(bytes: Uint8Array, name: string): void {
  const r = readTouchstone(bytes, { fileName: name }); // must not throw
  if (r.value) {
    expect(r.errors).toEqual([]);
    return;
  }
  expect(r.errors).toHaveLength(1);
  const e = r.errors[0];
  expect(CODES.has(e.code)).toBe(true);
  expect(e.message.length).toBeGreaterThan(10);
  // lines end in LF; a text with CR but no LF is read with CR as the line end (classic Mac OS files)
  const end = bytes.includes(10) || !bytes.includes(13) ? 10 : 13;
  let lines = 1;
  for (const b of bytes) if (b === end) lines++;
  expect(e.line).toBeGreaterThanOrEqual(0);
  expect(e.line).toBeLessThanOrEqual(lines);
}

describe('the reader never crashes', () => {
  it('on random bytes', () => {
    fc.assert(
      fc.property(fc.uint8Array({ maxLength: 400 }), fc.constantFrom('a.s1p', 'a.s2p', 'a.s4p', 'a.ts'), (b, name) => checkOutcome(b, name)),
      { numRuns: 500 },
    );
  });

  it('on mutated valid files', () => {
    const interesting = [...'0123456789 \t\n\r!#[]-+.eE,R'].map((c) => c.charCodeAt(0));
    fc.assert(
      fc.property(caseArb, fc.array(fc.tuple(fc.nat(), fc.constantFrom(...interesting, 0, 200)), { minLength: 1, maxLength: 6 }), (c, edits) => {
        const bytes = new TextEncoder().encode(writeTouchstone(c.net, c.options));
        for (const [at, b] of edits) bytes[at % bytes.length] = b;
        checkOutcome(bytes, fileName(c));
      }),
      { numRuns: 400 },
    );
  });
});
