import { describe, expect, it } from 'vitest';
import { interpolate, ExtrapolationError } from '../../src/network/interpolate.js';
import { entry } from '../../src/network/network.js';
import { groupDelay, magnitude } from '../../src/network/traces.js';
import { expectClose, networkOf, cx, polar, sAt } from '../helpers.js';

describe('interpolation', () => {
  // a lossy delay line: |S21| = 0.9, τ = 2 ns (72° per 100 MHz)
  const freqs = [1e9, 1.1e9, 1.2e9, 1.3e9];
  const net = networkOf(freqs, 50, (f) => [
    [cx(0.1), polar(0.9, -360 * f * 2e-9)],
    [polar(0.9, -360 * f * 2e-9), cx(0.1)],
  ]);

  it('polar interpolation keeps |S21| and the group delay between points', () => {
    const fine = Float64Array.from({ length: 31 }, (_, k) => 1e9 + k * 1e7);
    const out = interpolate(net, fine);
    for (const m of magnitude(entry(out, 2, 1))) expectClose(m, 0.9, 1e-12, '|S21|');
    for (const t of groupDelay(out.freqHz, entry(out, 2, 1))) expectClose(t, 2e-9, 1e-15, 'τ');
  });

  it('rectangular interpolation cuts the chord (shown for contrast): |S21| dips between points', () => {
    const out = interpolate(net, Float64Array.of(1.05e9), 'rectangular');
    // chord midpoint of a 72° arc: 0.9·cos(36°)
    expectClose(Math.hypot(...sAt(out, 0, 2, 1)), 0.9 * Math.cos((36 * Math.PI) / 180), 1e-12);
  });

  it('returns the measured values at measured frequencies', () => {
    const out = interpolate(net, Float64Array.of(1.1e9, 1.3e9));
    expectClose(sAt(out, 0, 2, 1)[0], sAt(net, 1, 2, 1)[0], 1e-15);
    expectClose(sAt(out, 1, 2, 1)[1], sAt(net, 3, 2, 1)[1], 1e-15);
  });

  it('refuses to extrapolate', () => {
    expect(() => interpolate(net, Float64Array.of(0.9e9))).toThrow(ExtrapolationError);
    expect(() => interpolate(net, Float64Array.of(1.31e9))).toThrow(/does not extrapolate/);
  });
});
