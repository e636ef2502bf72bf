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
import { loadPartText } from '../../src/spec/load.js';
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
  const unit = (il: number, unitName: string) => ({ unit: unitName, file: `${unitName}.s2p`, conditions: {}, fileAt: { line: 0, column: 0 }, network: networkOf(freqs, 50, () => [[cx(0.1), cx(0)], [cx(Math.pow(10, -il / 20)), cx(0.05)]]) });
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
