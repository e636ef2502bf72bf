/**
 * One precision policy (README, "Figures"): frequency figures are shown to the
 * resolution the measured grid supports — the decade below its step — so a
 * bandwidth interpolated on a 5 MHz grid reads 136 MHz, not 135.8415 MHz; the
 * JSON keeps the exact value. Other units keep their fixed decimals.
 */
import { describe, expect, it } from 'vitest';
import { formatFrequencyTo, gridResolutionHz } from '../../src/format/units.js';
import { formatNumber, formatValue } from '../../src/format/values.js';

describe('precision', () => {
  it('the resolution of a grid is the decade below its (median) step', () => {
    expect(gridResolutionHz([0, 5e6, 10e6, 15e6])).toBe(1e6);
    expect(gridResolutionHz([1e9, 1.01e9, 1.02e9])).toBe(1e7);
    expect(gridResolutionHz(Float64Array.from({ length: 1601 }, (_, k) => 1e7 + k * 11.24375e6))).toBe(1e7);
    expect(gridResolutionHz([1e9])).toBeNull();
  });

  it('a frequency figure is rounded to it: 135.8415 MHz on a 5 MHz grid reads 136 MHz', () => {
    expect(formatFrequencyTo(135.8415e6, 1e6)).toBe('136 MHz');
    expect(formatValue(135.8415e6, 'Hz', gridResolutionHz([0, 5e6, 10e6]))).toBe('136 MHz');
    expect(formatValue(2.4512345e9, 'Hz', 1e6)).toBe('2.451 GHz');
    expect(formatNumber(135.8415e6, 'Hz', { scale: 1e-6 }, 1e6)).toBe('136');
    expect(formatNumber(135.8415e6, 'Hz', { scale: 1e-6 }, 1e5)).toBe('135.8');
  });

  it('other units keep their fixed decimals', () => {
    expect([
      formatValue(1.23456, 'dB'),
      formatValue(89.987, 'deg'),
      formatValue(1.22222, ''),
      formatValue(4.7812e-9, 's'),
      formatValue(47.812e-12, 's'),
    ]).toEqual(['1.23 dB', '89.99°', '1.222', '4.781 ns', '47.81 ps']);
  });
});
