import { mkdirSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
/** Shared test helpers: building small networks and comparing numbers with stated tolerances. */
import { expect } from 'vitest';
import { makeNetwork, type Network } from '../src/network/network.js';

export type Cx = [number, number];
/** S matrix at one frequency as rows of [re, im]. */
export type Matrix = Cx[][];

/** A network from a function giving the matrix at each frequency. */
export function networkOf(freqHz: number[], z0: number | number[], sAt: (f: number, k: number) => Matrix): Network {
  const m0 = sAt(freqHz[0], 0);
  const n = m0.length;
  const s = new Float64Array(freqHz.length * n * n * 2);
  freqHz.forEach((f, k) => {
    const m = k === 0 ? m0 : sAt(f, k);
    for (let i = 0; i < n; i++)
      for (let j = 0; j < n; j++) {
        s[2 * ((k * n + i) * n + j)] = m[i][j][0];
        s[2 * ((k * n + i) * n + j) + 1] = m[i][j][1];
      }
  });
  const z = typeof z0 === 'number' ? new Float64Array(n).fill(z0) : Float64Array.from(z0);
  return makeNetwork(Float64Array.from(freqHz), z, s, n);
}

export const cx = (re: number, im = 0): Cx => [re, im];
export const polar = (mag: number, deg: number): Cx => [mag * Math.cos((deg * Math.PI) / 180), mag * Math.sin((deg * Math.PI) / 180)];

/** S(i+1)(j+1) at frequency k. */
export function sAt(net: Network, k: number, i: number, j: number): Cx {
  const p = 2 * ((k * net.ports + i - 1) * net.ports + j - 1);
  return [net.s[p], net.s[p + 1]];
}

export function expectClose(actual: number, expected: number, tol: number, what = ''): void {
  if (!(Math.abs(actual - expected) <= tol)) {
    throw new Error(`${what ? what + ': ' : ''}expected ${expected} ± ${tol}, got ${actual} (off by ${Math.abs(actual - expected)})`);
  }
  expect(true).toBe(true);
}

export function expectComplexClose(actual: Cx, expected: Cx, tol: number, what = ''): void {
  const d = Math.hypot(actual[0] - expected[0], actual[1] - expected[1]);
  if (!(d <= tol))
    throw new Error(
      `${what ? what + ': ' : ''}expected ${expected[0]}${expected[1] >= 0 ? '+' : ''}${expected[1]}j ± ${tol}, got ${actual[0]}${actual[1] >= 0 ? '+' : ''}${actual[1]}j`,
    );
}

/** Largest |a − b| over arrays, or over interleaved complex arrays. */
export function maxAbsDiff(a: ArrayLike<number>, b: ArrayLike<number>): number {
  expect(a.length).toBe(b.length);
  let m = 0;
  for (let i = 0; i < a.length; i++) m = Math.max(m, Math.abs(a[i] - b[i]));
  return m;
}

import { evaluatePart, type PartResult } from '../src/evaluate/evaluate.js';
import { makeCompiler } from '../src/figures/expression.js';
import { loadPartText } from '../src/part-file/load.js';
import type { SpecError } from '../src/part-file/diagnostics.js';
import { create, all } from 'mathjs';
import type { NoiseParameters } from '../src/touchstone/normalize.js';

const compile = makeCompiler(create(all));

/**
 * Loads part YAML from a string and evaluates it against networks given by
 * unit name (no files): the figure engine end to end without the shell.
 */
export function evaluateYaml(
  yaml: string,
  networks: Record<string, Network>,
  noise: Record<string, NoiseParameters | null> = {},
): { result: PartResult | null; errors: readonly SpecError[] } {
  const loaded = loadPartText(yaml, 'part.yaml', compile);
  if (!loaded.value) return { result: null, errors: loaded.errors };
  const units = loaded.value.measurements.map((m) => ({
    unit: m.label,
    file: m.file,
    network: networks[m.unit],
    noise: noise[m.unit] ?? null,
    conditions: m.conditions,
    fileAt: m.fileAt,
  }));
  const r = evaluatePart(loaded.value, units);
  return { result: r.value, errors: r.errors };
}

/** Like evaluateYaml, but fails the test on errors. */
export function resultsOf(yaml: string, networks: Record<string, Network>, noise: Record<string, NoiseParameters | null> = {}): PartResult {
  const r = evaluateYaml(yaml, networks, noise);
  if (!r.result) throw new Error(`unexpected errors: ${JSON.stringify(r.errors, null, 1)}`);
  return r.result;
}

/** A minimal part around the given limits, with one measurement per unit name. */
export function partYaml(opts: { cls?: string; units: string[]; bands: string; limits: string; extra?: string; conditions?: Record<string, string> }): string {
  const ms = opts.units
    .map((u) => `  - {unit: ${u}, file: ${u}.s4p${opts.conditions?.[u] ? `, conditions: {temperature: ${opts.conditions[u]}}` : ''}}`)
    .join('\n');
  return `part: T-1\nclass: ${opts.cls ?? 'generic'}\nrevision: A\nmeasurements:\n${ms}\nbands:\n${opts.bands}\nlimits:\n${opts.limits}\n${opts.extra ?? ''}`;
}

const TINY_DATA = '# GHz S MA R 50\n1 0.1 0 0.9 -10 0.9 -10 0.1 0\n2 0.1 0 0.9 -20 0.9 -20 0.1 0\n';

/** A content folder under `root` with one small attenuator part per slug (an invented 2-point file, 1–2 GHz), for tests of the build's plumbing. */
export function tinyContent(root: string, slugs: readonly string[]): string {
  for (const slug of slugs) {
    mkdirSync(join(root, 'parts', slug, 'data'), { recursive: true });
    writeFileSync(join(root, 'parts', slug, 'data/u1.s2p'), TINY_DATA);
    writeFileSync(
      join(root, 'parts', slug, 'part.yaml'),
      `part: ${slug.toUpperCase()}\nrevision: A\nclass: attenuator\nmeasurements:\n  - {unit: U1, file: data/u1.s2p}\nbands:\n  b: {from: 1 GHz, to: 2 GHz}\nlimits:\n  - {figure: insertion-loss, on: S21, band: b, max: 2 dB}\n`,
    );
  }
  return root;
}
