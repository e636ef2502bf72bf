import { describe, expect, it } from 'vitest';
import { mixedModeIndex, toMixedMode, PAIRS_ACROSS } from '../../src/network/mixedmode.js';
import { selectPorts } from '../../src/network/ports.js';
import { expectComplexClose, networkOf, cx, sAt, type Matrix } from '../helpers.js';

// A general (non-symmetric) 4-port: S(i,j) = (0.1·i + 0.01·j, 0.02·i − 0.03·j)
const general: Matrix = [1, 2, 3, 4].map((i) => [1, 2, 3, 4].map((j) => cx(0.1 * i + 0.01 * j, 0.02 * i - 0.03 * j)));
const net = networkOf([1e9], 50, () => general);
const S = (i: number, j: number) => general[i - 1][j - 1];
const comb = (terms: Array<[number, number, number]>): [number, number] =>
  terms.reduce<[number, number]>((acc, [sign, i, j]) => [acc[0] + 0.5 * sign * S(i, j)[0], acc[1] + 0.5 * sign * S(i, j)[1]], [0, 0]);

describe('mixed-mode S-parameters (Bockelman & Eisenstadt 1995), pairs (1,2) in and (3,4) out', () => {
  const mm = toMixedMode(net);

  it('Sdd21 = ½(S31 − S32 − S41 + S42)', () => {
    const [r, c] = mixedModeIndex(mm, 'Sdd21');
    expectComplexClose(
      sAt(mm, 0, r, c),
      comb([
        [1, 3, 1],
        [-1, 3, 2],
        [-1, 4, 1],
        [1, 4, 2],
      ]),
      1e-15,
    );
  });
  it('Scc21 = ½(S31 + S32 + S41 + S42)', () => {
    const [r, c] = mixedModeIndex(mm, 'Scc21');
    expectComplexClose(
      sAt(mm, 0, r, c),
      comb([
        [1, 3, 1],
        [1, 3, 2],
        [1, 4, 1],
        [1, 4, 2],
      ]),
      1e-15,
    );
  });
  it('Sdc21 = ½(S31 + S32 − S41 − S42)', () => {
    const [r, c] = mixedModeIndex(mm, 'Sdc21');
    expectComplexClose(
      sAt(mm, 0, r, c),
      comb([
        [1, 3, 1],
        [1, 3, 2],
        [-1, 4, 1],
        [-1, 4, 2],
      ]),
      1e-15,
    );
  });
  it('Scd21 = ½(S31 − S32 + S41 − S42)', () => {
    const [r, c] = mixedModeIndex(mm, 'Scd21');
    expectComplexClose(
      sAt(mm, 0, r, c),
      comb([
        [1, 3, 1],
        [-1, 3, 2],
        [1, 4, 1],
        [-1, 4, 2],
      ]),
      1e-15,
    );
  });
  it('references: 100 Ω differential, 25 Ω common from 50 Ω legs', () => {
    expect(Array.from(mm.z0)).toEqual([100, 100, 25, 25]);
    expect(mm.modes).toEqual(['D1', 'D2', 'C1', 'C2']);
  });
  it('pairs (1,3),(2,4) equal pairs (1,2),(3,4) after reordering ports 1,3,2,4', () => {
    const across = toMixedMode(net, PAIRS_ACROSS);
    const reordered = toMixedMode(selectPorts(net, [1, 3, 2, 4]));
    for (let i = 0; i < across.s.length; i++) expect(Math.abs(across.s[i] - reordered.s[i])).toBeLessThan(1e-15);
  });
  it('refuses a pairing that repeats a port', () => {
    expect(() =>
      toMixedMode(net, [
        [1, 2],
        [2, 4],
      ]),
    ).toThrow(/two pairs/);
  });
});
