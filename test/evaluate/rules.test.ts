/**
 * The evaluation rules, on small hand-made data with hand-computed answers:
 * band edges, ties, worst and typical over units, conditions, and the errors
 * that only the data can show.
 */
import { describe, expect, it } from 'vitest';
import { evaluateYaml, networkOf, resultsOf, cx } from '../helpers.js';

/** A 2-port whose |S21| in dB is given at each frequency (loss = −dB). */
const lossNet = (points: Array<[number, number]>) =>
  networkOf(
    points.map((p) => p[0]),
    50,
    (_, k) => [
      [cx(0.01), cx(0)],
      [cx(Math.pow(10, -points[k][1] / 20)), cx(0.01)],
    ],
  );

const part = (units: Array<[string, string?]>, bands: string, limits: string) =>
  `part: R-1\nclass: filter\nmeasurements:\n${units.map(([u, t]) => `  - {unit: ${u}, file: ${u.toLowerCase()}.s2p${t ? `, conditions: {temperature: ${t}}` : ''}}`).join('\n')}\nbands:\n${bands}\nlimits:\n${limits}\n`;

describe('band evaluation set', () => {
  // loss 1 dB at 1 GHz, 2 dB at 2 GHz, 4 dB at 3 GHz
  const net = lossNet([
    [1e9, 1],
    [2e9, 2],
    [3e9, 4],
  ]);

  it('a band edge between measured points takes the linear interpolation of the figure: 2.5 GHz → 3 dB', () => {
    const r = resultsOf(part([['A']], '  b: {from: 1.5 GHz, to: 2.5 GHz}', '  - {figure: insertion-loss, on: S21, band: b, max: 5 dB}'), { A: net }).results[0];
    expect(r.worst).toBeCloseTo(3, 12); // (2 + 4)/2 at the upper edge
    expect(r.worstAtHz).toBe(2.5e9);
    expect(r.margin).toBeCloseTo(2, 12);
  });

  it('the lower edge: 1.5 GHz → 1.5 dB is the best; rejection (min) finds it', () => {
    const r = resultsOf(part([['A']], '  b: {from: 1.5 GHz, to: 2.5 GHz}', '  - {figure: rejection, on: S21, band: b, min: 1 dB}'), { A: net }).results[0];
    expect(r.worst).toBeCloseTo(1.5, 12);
    expect(r.worstAtHz).toBe(1.5e9);
  });

  it('edges that are measured points are not doubled, and a single frequency works', () => {
    const r = resultsOf(part([['A']], '  b: {from: 2 GHz, to: 2 GHz}', '  - {figure: insertion-loss, on: S21, band: b, max: 5 dB}'), { A: net }).results[0];
    expect(r.worst).toBeCloseTo(2, 12);
    expect(r.worstAtHz).toBe(2e9);
  });

  it('a band reaching outside the measured range is an error naming the band, the file and the range', () => {
    const r = evaluateYaml(part([['A']], '  b: {from: 0.5 GHz, to: 2.5 GHz}', '  - {figure: insertion-loss, on: S21, band: b, max: 5 dB}'), { A: net });
    expect(r.errors[0]).toMatchObject({ code: 'band-outside-data', line: 6, column: 6 });
    expect(r.errors[0].message).toBe('band b (500 MHz to 2.5 GHz) reaches outside the measured range of a.s2p (1 GHz to 3 GHz)');
  });
});

describe('worst, ties, typical', () => {
  it('ties go to the lowest frequency', () => {
    const net = lossNet([
      [1e9, 3],
      [2e9, 1],
      [3e9, 3],
    ]);
    const r = resultsOf(part([['A']], '  b: {from: 1 GHz, to: 3 GHz}', '  - {figure: insertion-loss, on: S21, band: b, max: 5 dB}'), { A: net }).results[0];
    expect(r.worstAtHz).toBe(1e9);
  });

  it('over several parameters, the least margin wins and worstOn names it', () => {
    const net = networkOf([1e9, 2e9], 50, (f) => [
      [cx(f === 2e9 ? 0.2 : 0.05), cx(0)],
      [cx(0.9), cx(0.15)],
    ]);
    const r = resultsOf(part([['A']], '  b: {from: 1 GHz, to: 2 GHz}', '  - {figure: return-loss, on: [S11, S22], band: b, min: 10 dB}'), { A: net })
      .results[0];
    expect(r.worstOn).toBe('S11');
    expect(r.worst).toBeCloseTo(-20 * Math.log10(0.2), 12);
    expect(r.worstAtHz).toBe(2e9);
  });

  it('typical is the worst of the median unit ranked by margin (3 units: the middle one; 4 units: the middle one with the smaller margin); worst is the least margin', () => {
    const units = {
      A: lossNet([
        [1e9, 1],
        [2e9, 1.2],
      ]),
      B: lossNet([
        [1e9, 1.5],
        [2e9, 1.1],
      ]),
      C: lossNet([
        [1e9, 0.9],
        [2e9, 2.4],
      ]),
      D: lossNet([
        [1e9, 1.3],
        [2e9, 1.0],
      ]),
    };
    const limits = '  - {figure: insertion-loss, on: S21, band: b, max: 2 dB}';
    const three = resultsOf(part([['A'], ['B'], ['C']], '  b: {from: 1 GHz, to: 2 GHz}', limits), units).results[0];
    expect(three.units.map((u) => u.worst.toFixed(6))).toEqual(['1.200000', '1.500000', '2.400000']);
    expect(three.typical).toBeCloseTo(1.5, 12);
    expect(three.typicalUnit).toBe('B');
    expect(three.worst).toBeCloseTo(2.4, 12);
    expect(three.worstUnit).toBe('C');
    expect(three.margin).toBeCloseTo(-0.4, 12);
    expect(three.pass).toBe(false);
    expect(three.units.map((u) => u.pass)).toEqual([true, true, false]);
    // worsts 1.2, 1.5, 2.4, 1.3 → margins 0.8, 0.5, −0.4, 0.7 → ranked C B D A; the middle two are B and D, B has the smaller margin
    const four = resultsOf(part([['A'], ['B'], ['C'], ['D']], '  b: {from: 1 GHz, to: 2 GHz}', limits), units).results[0];
    expect(four.typical).toBeCloseTo(1.5, 12);
    expect(four.typicalUnit).toBe('B');
  });

  it('a two-sided limit: units that err on opposite sides do not cancel', () => {
    // worsts 10.6, 9.3, 10.2 dB against 10 ± 1 dB: margins 0.4, 0.3, 0.8 → the median unit is A (10.6 dB, 0.6 dB off);
    // the old median of signed worsts gave 10.2, which no unit's worst deviation is
    const units = {
      A: lossNet([
        [1e9, 10.6],
        [2e9, 10.1],
      ]),
      B: lossNet([
        [1e9, 9.3],
        [2e9, 9.9],
      ]),
      C: lossNet([
        [1e9, 10.2],
        [2e9, 10.0],
      ]),
    };
    const r = resultsOf(
      part([['A'], ['B'], ['C']], '  b: {from: 1 GHz, to: 2 GHz}', '  - {figure: insertion-loss, on: S21, band: b, nominal: 10 dB, tolerance: 1 dB}'),
      units,
    ).results[0];
    expect(r.typicalUnit).toBe('A');
    expect(r.typical).toBeCloseTo(10.6, 12);
  });

  it("without a limit, units are ranked by the figure's bad direction", () => {
    const units = {
      A: lossNet([
        [1e9, 1],
        [2e9, 1.2],
      ]),
      B: lossNet([
        [1e9, 1.5],
        [2e9, 1.1],
      ]),
      C: lossNet([
        [1e9, 0.9],
        [2e9, 2.4],
      ]),
    };
    const yaml = part([['A'], ['B'], ['C']], '  b: {from: 1 GHz, to: 2 GHz}', '  - {figure: insertion-loss, on: S21, band: b, max: 9 dB}').replace(
      'limits:\n  - {figure: insertion-loss, on: S21, band: b, max: 9 dB}',
      'report:\n  - {figure: insertion-loss, on: S21, band: b}',
    );
    const r = resultsOf(yaml, units).results[0];
    expect(r.typical).toBeCloseTo(1.5, 12);
    expect(r.typicalUnit).toBe('B');
  });

  it('typical-at: typical from the units measured there, the limit from every unit it covers', () => {
    const units = {
      A: lossNet([
        [1e9, 1],
        [2e9, 1],
      ]),
      B: lossNet([
        [1e9, 2],
        [2e9, 2],
      ]),
      C: lossNet([
        [1e9, 3],
        [2e9, 3],
      ]),
    };
    const yaml = part(
      [
        ['A', '25 °C'],
        ['B', '85 °C'],
        ['C', '85 °C'],
      ],
      '  b: {from: 1 GHz, to: 2 GHz}',
      '  - {figure: insertion-loss, on: S21, band: b, max: 3.5 dB}',
    );
    const all = resultsOf(yaml, units).results[0];
    expect(all.typical).toBeCloseTo(2, 12);
    expect([all.typicalAt, all.typicalMixed]).toEqual([null, true]);
    const at = resultsOf(`${yaml}typical-at: {temperature: 25 °C}\n`, units).results[0];
    expect(at.typical).toBeCloseTo(1, 12);
    expect([at.typicalUnit, at.typicalAt, at.typicalMixed, at.worstUnit]).toEqual(['A', { temperature: '25 °C' }, false, 'C']);
    const none = evaluateYaml(`${yaml}typical-at: {temperature: 55 °C}\n`, units);
    expect(none.errors[0]).toMatchObject({ code: 'unknown-condition' });
  });

  it('nominal ± tolerance: margin = tolerance − |value − nominal|', () => {
    const net = lossNet([
      [1e9, 19.2],
      [2e9, 20.6],
    ]);
    const r = resultsOf(part([['A']], '  b: {from: 1 GHz, to: 2 GHz}', '  - {figure: coupling, on: S21, band: b, nominal: 20 dB, tolerance: 0.5 dB}'), {
      A: net,
    }).results[0];
    expect(r.worst).toBeCloseTo(19.2, 12);
    expect(r.margin).toBeCloseTo(0.5 - 0.8, 12);
  });

  it('max and min together form a window', () => {
    const net = lossNet([
      [1e9, 0.4],
      [2e9, 1.1],
    ]);
    const r = resultsOf(part([['A']], '  b: {from: 1 GHz, to: 2 GHz}', '  - {figure: insertion-loss, on: S21, band: b, min: 0.5 dB, max: 1.2 dB}'), { A: net })
      .results[0];
    expect(r.worst).toBeCloseTo(0.4, 12);
    expect(r.margin).toBeCloseTo(-0.1, 12);
  });
});

describe('conditions', () => {
  const units = {
    A: lossNet([
      [1e9, 1],
      [2e9, 1],
    ]),
    B: lossNet([
      [1e9, 2],
      [2e9, 2],
    ]),
    C: lossNet([
      [1e9, 3],
      [2e9, 3],
    ]),
  };
  const ms: Array<[string, string]> = [
    ['A', '25 °C'],
    ['B', '85 °C'],
    ['C', '−40 °C'],
  ];
  it('a limit with when: covers only the matching units; without it, all', () => {
    const r = resultsOf(
      part(
        ms,
        '  b: {from: 1 GHz, to: 2 GHz}',
        '  - {figure: insertion-loss, on: S21, band: b, max: 1.5 dB, when: {temperature: 25 °C}}\n  - {figure: insertion-loss, on: S21, band: b, max: 3.5 dB}',
      ),
      units,
    ).results;
    expect(r[0].units.map((u) => u.unit)).toEqual(['A']);
    expect(r[0].pass).toBe(true);
    expect(r[1].units.map((u) => u.unit)).toEqual(['A', 'B', 'C']);
    expect(r[1].worstUnit).toBe('C');
  });
  it('condition text is compared after folding blanks', () => {
    const r = resultsOf(
      part(ms, '  b: {from: 1 GHz, to: 2 GHz}', '  - {figure: insertion-loss, on: S21, band: b, max: 3 dB, when: {temperature: "85   °C"}}'),
      units,
    ).results;
    expect(r[0].units.map((u) => u.unit)).toEqual(['B']);
  });
});

describe('errors that only the data show', () => {
  it("a port beyond the files' port count", () => {
    const r = evaluateYaml(part([['A']], '  b: {from: 1 GHz, to: 2 GHz}', '  - {figure: insertion-loss, on: S31, band: b, max: 1 dB}'), {
      A: lossNet([
        [1e9, 1],
        [2e9, 1],
      ]),
    });
    expect(r.errors[0]).toMatchObject({ code: 'port-range', line: 8, column: 34 });
    expect(r.errors[0].message).toBe('S31 needs port 3, but the measured files have 2 ports');
  });

  it('units whose files disagree on the port count', () => {
    const three = networkOf([1e9, 2e9], 50, () => [
      [cx(0), cx(0), cx(0)],
      [cx(0.9), cx(0), cx(0)],
      [cx(0), cx(0), cx(0)],
    ]);
    const r = evaluateYaml(part([['A'], ['B']], '  b: {from: 1 GHz, to: 2 GHz}', '  - {figure: insertion-loss, on: S21, band: b, max: 1 dB}'), {
      A: lossNet([
        [1e9, 1],
        [2e9, 1],
      ]),
      B: three,
    });
    expect(r.errors[0]).toMatchObject({ code: 'port-count-mismatch', line: 5 });
    expect(r.errors[0].message).toContain('unit B (b.s2p) has 3 ports but unit A (a.s2p) has 2');
  });
});
