/**
 * Numbers that are computed right but would mislead: excess loss over the
 * right number of ways (a hybrid splits 2 ways whatever its port count), a
 * negative excess loss on a passive part, and an aliased group delay. The
 * expected values are computed by hand from the definitions (excess loss =
 * IL − 10·log10 N, common practice; τ = −dφ/dω, which cannot be resolved
 * where the phase turns more than 180° between points, Δf > 1/(2τ)).
 */
import { describe, expect, it } from 'vitest';
import { cx, networkOf, polar, resultsOf, partYaml } from '../helpers.js';

const band = '  b: {from: 1 GHz, to: 2 GHz}';

describe('excess loss by class', () => {
  // an ideal quadrature hybrid: |S21| = |S31| = 1/√2, 4 ports
  const h = Math.SQRT1_2;
  const hybrid = networkOf([1e9, 2e9], 50, () => [
    [cx(0), cx(0, -h), cx(-h), cx(0)],
    [cx(0, -h), cx(0), cx(0), cx(-h)],
    [cx(-h), cx(0), cx(0), cx(0, -h)],
    [cx(0), cx(-h), cx(0, -h), cx(0)],
  ]);
  const limit = '  - {figure: excess-loss, on: [S21, S31], band: b, max: 0.5 dB}';

  it('a hybrid splits 2 ways: an ideal one has 0 dB excess loss (not 3.01 − 4.77 = −1.76 dB)', () => {
    const r = resultsOf(partYaml({ cls: 'hybrid', units: ['U1'], bands: band, limits: limit }), { U1: hybrid });
    expect(r.results[0].worst).toBeCloseTo(0, 12);
    expect(r.warnings).toEqual([]);
  });

  it('a divider of 4 ports with the wrong ways: negative excess loss on a passive part is a warning at the limit', () => {
    const r = resultsOf(partYaml({ cls: 'divider', units: ['U1'], bands: band, limits: limit }), { U1: hybrid });
    // N = ports − 1 = 3: 3.0103 − 4.7712 = −1.7609 dB
    expect(r.results[0].worst).toBeCloseTo(10 * Math.log10(2) - 10 * Math.log10(3), 10);
    expect(r.results[0].pass).toBe(true);
    expect(r.warnings).toHaveLength(1);
    expect(r.warnings[0]).toMatchObject({ code: 'negative-excess-loss', line: 9 });
    expect(r.warnings[0].message).toContain('comes out negative (−1.761 dB'.replace('−', '-'));
    expect(r.warnings[0].message).toContain('is ways (N = 3) right for it?');
  });
});

describe('an aliased group delay', () => {
  // a 10 ns lossless line sampled every 60 MHz: the phase turns 216° per step, which unwraps as −144°,
  // so the delay reads 144/360/60 MHz = −6.667 ns, and passes a max 12 ns limit
  const freqs = Array.from({ length: 18 }, (_, k) => 1e9 + k * 60e6);
  const line = networkOf(freqs, 50, (f) => [
    [cx(0), polar(1, -360 * f * 10e-9)],
    [polar(1, -360 * f * 10e-9), cx(0)],
  ]);
  const limits = '  - {figure: group-delay, on: S21, band: b, max: 12 ns}';

  it('reads −6.667 ns and is flagged: a warning naming the band, the frequency and the grid step', () => {
    const r = resultsOf(partYaml({ cls: 'cable', units: ['U1'], bands: band, limits }), { U1: line });
    expect(r.results[0].worst).toBeCloseTo(-(360 - 216) / 360 / 60e6, 15);
    expect(r.warnings).toHaveLength(1);
    expect(r.warnings[0].code).toBe('delay-aliased');
    expect(r.warnings[0].message).toMatch(
      /comes out negative \(-6\.667 ns at [\d.]+ GHz\) on a passive part over b: .*\(they are 60 MHz apart, so delays above 1\/\(2Δf\) = 8\.333 ns alias/,
    );
  });

  it('the same line on a 10 MHz grid reads 10 ns with no warning', () => {
    const fine = Array.from({ length: 101 }, (_, k) => 1e9 + k * 10e6);
    const net = networkOf(fine, 50, (f) => [
      [cx(0), polar(1, -360 * f * 10e-9)],
      [polar(1, -360 * f * 10e-9), cx(0)],
    ]);
    const r = resultsOf(partYaml({ cls: 'cable', units: ['U1'], bands: band, limits }), { U1: net });
    expect(r.results[0].worst).toBeCloseTo(10e-9, 15);
    expect(r.warnings).toEqual([]);
  });
});
