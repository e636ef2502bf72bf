/**
 * Plot models and specs: limit regions lie exactly over their bands on the
 * forbidden side, thinning keeps every extreme, the median and spread are
 * those of the units, and the Vega-Lite JSON of a demo plot matches its
 * committed golden (deterministic text; rendered SVG is not compared).
 * UPDATE_GOLDENS=1 rewrites the golden.
 */
import { existsSync, readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { loadPartText } from '../../src/part-file/load.js';
import { buildPlots, thin } from '../../src/plots/model.js';
import { plotSpec } from '../../src/plots/spec.js';
import { renderPlot } from '../../src/plots/render.js';
import { evaluatePartFile } from '../../src/pipeline/part.js';
import { cx, networkOf } from '../helpers.js';

const ROOT = join(import.meta.dirname, '../..');

describe('thinning', () => {
  it('keeps the lowest and highest point of every column and both ends', () => {
    const xs = Float64Array.from({ length: 1601 }, (_, k) => k);
    const ys = Float64Array.from(xs, (x) => Math.sin(x / 7) + (x === 777 ? 5 : 0) - (x === 1234 ? 5 : 0));
    const t = thin(xs, ys, 0, 1600, 100);
    expect(t.length).toBeLessThanOrEqual(2 * 100 + 2);
    expect(t[0]).toEqual([0, ys[0]]);
    expect(t[t.length - 1]).toEqual([1600, ys[1600]]);
    expect(t.some(([x]) => x === 777)).toBe(true); // the spike
    expect(t.some(([x]) => x === 1234)).toBe(true); // the notch
    for (let i = 1; i < t.length; i++) expect(t[i][0]).toBeGreaterThan(t[i - 1][0]); // x order kept
  });
});

describe('plot models', () => {
  const yaml = `part: P\nclass: filter\nmeasurements:\n  - {unit: A, file: a.s2p}\n  - {unit: B, file: b.s2p}\n  - {unit: C, file: c.s2p}\nbands:\n  pass: {from: 2 GHz, to: 3 GHz}\nlimits:\n  - {figure: insertion-loss, on: S21, band: pass, max: 2 dB}\n  - {figure: return-loss, on: [S11, S22], band: pass, min: 15 dB}\n`;
  const part = loadPartText(yaml, 'p.yaml').value!;
  const freqs = Array.from({ length: 41 }, (_, k) => 1e9 + k * 1e8);
  const unit = (il: number, unitName: string) => ({
    unit: unitName,
    file: `${unitName}.s2p`,
    conditions: {},
    fileAt: { line: 0, column: 0 },
    network: networkOf(freqs, 50, () => [
      [cx(0.1), cx(0)],
      [cx(Math.pow(10, -il / 20)), cx(0.05)],
    ]),
  });
  const plots = buildPlots(part, [unit(1, 'A'), unit(1.5, 'B'), unit(3, 'C')]);

  it('draws the class defaults the part has data and limits for', () => {
    expect(plots.map((p) => p.title)).toEqual(['Insertion loss and rejection', 'Passband insertion loss', 'Return loss']);
  });

  it('a max limit is a region from the limit up to the top of the plot, over exactly its band', () => {
    const p = plots[0];
    expect(p.regions).toEqual([{ x0: 2, x1: 3, y0: 2, y1: p.yDomain[1] }]);
    expect(p.edges).toEqual([{ x0: 2, x1: 3, y: 2 }]);
    expect(p.xTitle).toBe('Frequency (GHz)');
    expect(p.yTitle).toBe('Insertion loss (dB)');
    expect(p.downward).toBe(true);
  });

  it('a min limit is a region from the bottom of the plot up to the limit', () => {
    const rl = plots[2];
    expect(rl.regions).toEqual([{ x0: 2, x1: 3, y0: rl.yDomain[0], y1: 15 }]);
    expect(rl.items).toEqual(['S11', 'S22']);
  });

  it('the median and spread are those of the units at each point', () => {
    const p = plots[0];
    for (const m of p.median) expect(m.y).toBeCloseTo(1.5, 12);
    for (const e of p.envelope) {
      expect(e.lo).toBeCloseTo(1, 12);
      expect(e.hi).toBeCloseTo(3, 12);
    }
    expect(new Set(p.traces.map((t) => t.trace))).toEqual(new Set(['A S21', 'B S21', 'C S21']));
  });

  it('renders SVG with role="img", <title> and <desc>, and prefixed clip ids', async () => {
    const svg = await renderPlot(plots[0], 'x-');
    expect(svg.startsWith('<svg role="img" aria-labelledby="x-plot-1-title x-plot-1-desc"')).toBe(true);
    expect(svg).toContain('<title id="x-plot-1-title">Insertion loss and rejection</title>');
    expect(svg).toMatch(/<desc id="x-plot-1-desc">[^<]*3 measured units[^<]*forbid/);
    expect(svg).not.toMatch(/id="clip\d+"/);
  });
});

describe('limits on the traces they apply to', () => {
  const freqs = Array.from({ length: 21 }, (_, k) => 1e9 + k * 1e8);
  const amp = (gain: number, s11: number, unitName: string, temperature: string) => ({
    unit: `${unitName} @ ${temperature}`,
    serial: unitName,
    file: `${unitName}.s2p`,
    conditions: { temperature },
    fileAt: { line: 0, column: 0 },
    network: networkOf(freqs, 50, () => [
      [cx(s11), cx(0.01)],
      [cx(Math.pow(10, gain / 20)), cx(0.1)],
    ]),
  });
  const yaml = `part: A\nclass: amplifier\nmeasurements:\n${['U1', 'U2'].flatMap((u) => ['25 °C', '85 °C'].map((t) => `  - {unit: ${u}, file: ${u}.s2p, conditions: {temperature: ${t}}}`)).join('\n')}\nbands:\n  op: {from: 1 GHz, to: 3 GHz}\nlimits:\n  - {figure: gain, on: S21, band: op, min: 12 dB, when: {temperature: 25 °C}}\n  - {figure: gain, label: Gain over temperature, on: S21, band: op, min: 10 dB}\n  - {figure: return-loss, on: S11, band: op, min: 8 dB}\n  - {figure: return-loss, on: S22, band: op, min: 12 dB}\n`;
  const part = loadPartText(yaml, 'a.yaml').value!;
  const units = [amp(13, 0.2, 'U1', '25 °C'), amp(11, 0.3, 'U1', '85 °C'), amp(13.2, 0.2, 'U2', '25 °C'), amp(11.1, 0.3, 'U2', '85 °C')];
  const [gain, match] = buildPlots(part, units);

  it('traces per condition are their own series, with units counted once', () => {
    expect(gain.items).toEqual(['S21 at 25 °C', 'S21 at 85 °C']);
    expect([gain.unitCount, gain.measurementCount]).toEqual([2, 4]);
    expect(gain.colors[0]).not.toBe(gain.colors[1]); // colour by condition
    expect(gain.description).toContain('for 2 measured units (4 measurements)');
  });

  it("a limit restricted by when is a line in its condition's colour, never a region over the other condition's traces", () => {
    // the 85 °C traces (11 dB) lie below the 25 °C limit (12 dB): a shaded region there would put a PASS part in it
    expect(gain.seriesEdges).toEqual([{ x0: 1, x1: 3, y: 12, color: gain.colors[0], dash: gain.dashes[0] }]);
    expect(gain.seriesLimits.map((l) => l.label)).toEqual(['limit for S21 at 25 °C']);
    expect(gain.regions).toEqual([{ x0: 1, x1: 3, y0: gain.yDomain[0], y1: 10 }]); // the limit of every trace is shaded
    for (const t of gain.traces.filter((p) => p.item === 'S21 at 85 °C')) expect(t.y).toBeGreaterThan(10);
  });

  it("limits on different parameters are tied to their parameter's dash, not drawn alike", () => {
    expect(match.regions).toEqual([]);
    const s11 = match.items.indexOf('S11 at 25 °C'),
      s22 = match.items.indexOf('S22 at 25 °C');
    expect(match.seriesEdges.map((e) => [e.y, e.dash])).toEqual([
      [8, match.dashes[s11]],
      [12, match.dashes[s22]],
    ]);
    expect(match.dashes[s11]).not.toEqual(match.dashes[s22]);
    expect(match.seriesLimits.map((l) => l.label)).toEqual(['limit for S11', 'limit for S22']);
  });

  it("the axis names what is drawn: the limits' shared label, or the class plot's own (Attenuation, Electrical delay)", () => {
    const att = loadPartText(
      `part: T\nclass: attenuator\nmeasurements:\n  - {unit: A, file: a.s2p}\nbands:\n  all: {from: 1 GHz, to: 3 GHz}\nlimits:\n  - {figure: insertion-loss, on: S21, band: all, max: 7 dB}\n`,
      't.yaml',
    ).value!;
    expect(buildPlots(att, [units[0]])[0].yTitle).toBe('Attenuation (dB)');
    expect(match.yTitle).toBe('Return loss (dB)');
  });
});

describe('the Smith chart', () => {
  it("draws each unit's Γ inside the unit circle, its points the data themselves, and its SVG path where the axes put them", async () => {
    const o = await evaluatePartFile(join(ROOT, 'content/parts/vt-amp-0560/part.yaml'), join(ROOT, 'content'));
    const smith = buildPlots(o.part!, o.units).find((p) => p.kind === 'smith')!;
    expect(smith.items).toEqual(['S11', 'S22']);
    expect(smith.traces.length).toBeGreaterThan(0);
    for (const t of smith.traces) expect(Math.hypot(t.x, t.y)).toBeLessThan(1); // |S11|, |S22| < 1 for this matched amplifier
    // a few points against the files' own numbers: S11 of the first unit at its first, middle and last frequency
    const u = o.units[0];
    const n = u.network.freqHz.length;
    for (const k of [0, Math.floor(n / 2) - (Math.floor(n / 2) % Math.ceil(n / 400)), n - 1]) {
      const p = smith.traces.find((t) => t.trace === `${u.unit} S11` && t.k === k)!;
      expect(p, `point ${k}`).toBeDefined();
      expect(p.x).toBe(u.network.s[2 * (k * 4)]);
      expect(p.y).toBe(u.network.s[2 * (k * 4) + 1]);
    }
    // in the SVG, the first point of the first trace sits where the axes map it (300 px for −1.05 … 1.05)
    const svg = await renderPlot(smith, 's-');
    const path = /class="mark-line role-mark smith_traces_marks"[^>]*>\s*<path[^>]*d="M([\d.-]+),([\d.-]+)/.exec(svg);
    expect(path, 'a trace path').not.toBeNull();
    const first = smith.traces[0];
    const [px, py] = [Number(path![1]), Number(path![2])];
    expect(Math.abs(((first.x + 1.05) / 2.1) * 300 - px)).toBeLessThan(0.5);
    expect(Math.abs(((1.05 - first.y) / 2.1) * 300 - py)).toBeLessThan(0.5);
  });
});

describe('the Vega-Lite spec of a demo plot (golden)', () => {
  it('VT-BPF-2450, first plot', async () => {
    const o = await evaluatePartFile(join(ROOT, 'content/parts/vt-bpf-2450/part.yaml'), join(ROOT, 'content'));
    const spec = `${JSON.stringify(plotSpec(buildPlots(o.part!, o.units)[0]), null, 2)}\n`;
    const golden = join(import.meta.dirname, 'golden/vt-bpf-2450-plot-1.vl.json');
    if (process.env.UPDATE_GOLDENS) writeFileSync(golden, spec);
    expect(existsSync(golden), 'golden missing: run with UPDATE_GOLDENS=1').toBe(true);
    expect(spec).toBe(readFileSync(golden, 'utf8'));
  });
});
