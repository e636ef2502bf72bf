/**
 * Values that are not finite: the VSWR of a total reflection (|Γ| = 1 gives
 * (1 + 1)/(1 − 1) = ∞ by the definition, Pozar ch. 2, from memory) fails a
 * max limit with margin −∞, is written "Infinity" in figures --json (JSON has
 * no number for it; JSON.stringify would write null), and a band edge
 * interpolated next to it takes ∞ rather than NaN.
 */
import { describe, expect, it } from 'vitest';
import { figuresJson } from '../../src/evaluate/json.js';
import { interpolateAt } from '../../src/network/interpolate.js';
import { cx, networkOf, partYaml, resultsOf } from '../helpers.js';

describe('infinite values', () => {
  // |S11| = 0.1 at 1 GHz, 1 (open) at 2 GHz, 0.1 at 3 GHz
  const net = networkOf([1e9, 2e9, 3e9], 50, (f) => [
    [cx(f === 2e9 ? 1 : 0.1), cx(0.5)],
    [cx(0.5), cx(0.1)],
  ]);

  it('VSWR ∞ fails max 1.5 with margin −∞, and the JSON says "Infinity" and "-Infinity"', () => {
    const r = resultsOf(
      partYaml({ cls: 'generic', units: ['U1'], bands: '  b: {from: 1.5 GHz, to: 2.5 GHz}', limits: '  - {figure: vswr, on: S11, band: b, max: 1.5}' }),
      { U1: net },
    );
    const c = r.results[0];
    expect(c.worst).toBe(Infinity);
    expect(c.margin).toBe(-Infinity);
    expect(c.pass).toBe(false);
    const j = JSON.parse(JSON.stringify(figuresJson(r))) as {
      results: Array<{ worst: unknown; margin: unknown; typical: unknown; units: Array<{ worst: unknown; margin: unknown }> }>;
    };
    expect([j.results[0].worst, j.results[0].margin, j.results[0].typical]).toEqual(['Infinity', '-Infinity', 'Infinity']);
    expect([j.results[0].units[0].worst, j.results[0].units[0].margin]).toEqual(['Infinity', '-Infinity']);
  });

  it('band edges next to the infinite point are ∞, not NaN (the band 1.5–2.5 GHz has no finite neighbour pair)', () => {
    const x = Float64Array.from([1, 2, 3]);
    const y = Float64Array.from([1.222, Infinity, 1.222]);
    expect(interpolateAt(x, y, 1.5)).toBe(Infinity);
    expect(interpolateAt(x, y, 2.5)).toBe(Infinity);
    expect(interpolateAt(x, Float64Array.from([1, 2, 3]), 1.5)).toBe(1.5);
    expect(interpolateAt(x, Float64Array.from([Infinity, -Infinity, 0]), 1.5)).toBeNaN(); // ∞ − ∞ has no value
  });
});
