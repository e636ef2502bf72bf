/**
 * Files written in Touchstone 2's mixed-mode order ([Mixed-Mode Order], as
 * the Touchstone 2.0 specification defines it) hold modes, not single-ended
 * entries: Sdd21 names the entry in the row of descriptor D3,4 and the column
 * of D1,2; a single-ended name such as S21 is an error, never silently the
 * mixed-mode entry. Mixed-mode pairs of single-ended ports with different
 * references are an error at the pairs, not an internal fault.
 */
import { describe, expect, it } from 'vitest';
import { evaluatePart, type UnitData } from '../../src/evaluate/evaluate.js';
import { loadPartText } from '../../src/part-file/load.js';
import { readTouchstone } from '../../src/touchstone/read.js';
import { cx, networkOf } from '../helpers.js';

/** A 4-port in mixed-mode order D1,2 D3,4 C1,2 C3,4: Sdd21 (row D3,4, column D1,2) = 0.5, Scc21 = 0.25, all else 0.01. */
function mixedFile(): string {
  const row = (i: number) => Array.from({ length: 4 }, (_, j) => (i === 1 && j === 0 ? '0.5 0' : i === 3 && j === 2 ? '0.25 0' : '0.01 0')).join('  ');
  const point = (f: number) => `${f} ${[0, 1, 2, 3].map(row).join('\n')}`;
  return `[Version] 2.0\n# GHz S RI R 50\n[Number of Ports] 4\n[Number of Frequencies] 2\n[Mixed-Mode Order] D1,2 D3,4 C1,2 C3,4\n[Network Data]\n${point(1)}\n${point(2)}\n[End]\n`;
}

function evaluate(limits: string, extra = '') {
  const yaml = `part: MM-1\nclass: generic\nmeasurements:\n  - {unit: U1, file: u1.ts}\nbands:\n  b: {from: 1 GHz, to: 2 GHz}\nlimits:\n${limits}\n${extra}`;
  const part = loadPartText(yaml, 'part.yaml').value;
  if (!part) throw new Error('the part file should load');
  const data = readTouchstone(new TextEncoder().encode(mixedFile()), { fileName: 'u1.ts' }).value;
  if (!data) throw new Error('the file should read');
  const units: UnitData[] = [
    { unit: 'U1', file: 'u1.ts', network: data.network, mixedModeOrder: data.info.mixedModeOrder, conditions: {}, fileAt: { line: 4, column: 23 } },
  ];
  return evaluatePart(part, units);
}

describe('files in mixed-mode order', () => {
  it('Sdd21 and Scc21 are their entries by descriptor (|0.5| → 6.02 dB, |0.25| → 12.04 dB)', () => {
    const r = evaluate('  - {figure: insertion-loss, on: Sdd21, band: b, max: 7 dB}\n  - {figure: insertion-loss, on: Scc21, band: b, max: 13 dB}');
    expect(r.errors).toEqual([]);
    expect(r.value?.results[0].worst).toBeCloseTo(-20 * Math.log10(0.5), 12);
    expect(r.value?.results[1].worst).toBeCloseTo(-20 * Math.log10(0.25), 12);
    expect(r.value?.results[0].on).toEqual(['Sdd21']);
  });

  it('a single-ended name is an error at its position, never the mixed-mode entry relabelled', () => {
    const r = evaluate('  - {figure: insertion-loss, on: S21, band: b, max: 7 dB}');
    expect(r.value).toBeNull();
    expect(r.errors[0]).toMatchObject({ code: 'bad-parameter', line: 8 });
    expect(r.errors[0].message).toBe(
      'S21 names a single-ended entry, but u1.ts holds mixed-mode data ([Mixed-Mode Order] D1,2 D3,4 C1,2 C3,4): name its entries by mode, e.g. Sdd21, Scd21, Scc11',
    );
  });

  it('a mode port the file does not have is an error', () => {
    const r = evaluate('  - {figure: insertion-loss, on: Sdd31, band: b, max: 7 dB}');
    expect(r.errors[0].message).toBe('Sdd31 has no entry in u1.ts: its [Mixed-Mode Order] is D1,2 D3,4 C1,2 C3,4');
  });
});

describe('mixed-mode pairs of ports with different references', () => {
  it('are an error at the pairs naming the file and the references', () => {
    const net = networkOf([1e9, 2e9], [50, 75, 50, 50], () => [
      [cx(0), cx(0), cx(0.5), cx(0)],
      [cx(0), cx(0), cx(0), cx(0.5)],
      [cx(0.5), cx(0), cx(0), cx(0)],
      [cx(0), cx(0.5), cx(0), cx(0)],
    ]);
    const yaml =
      'part: MM-2\nclass: generic\nmixed-mode: {pairs: [[1, 2], [3, 4]]}\nmeasurements:\n  - {unit: U1, file: u1.s4p}\nbands:\n  b: {from: 1 GHz, to: 2 GHz}\nlimits:\n  - {figure: insertion-loss, on: Sdd21, band: b, max: 7 dB}\n';
    const part = loadPartText(yaml, 'part.yaml').value;
    if (!part) throw new Error('loads');
    const r = evaluatePart(part, [{ unit: 'U1', file: 'u1.s4p', network: net, conditions: {}, fileAt: { line: 5, column: 23 } }]);
    expect(r.value).toBeNull();
    expect(r.errors[0]).toMatchObject({ code: 'bad-value', line: 3 });
    expect(r.errors[0].message).toContain('mixed-mode pair [1, 2]: u1.s4p (unit U1) has references of 50 Ω and 75 Ω on these ports');
  });
});
