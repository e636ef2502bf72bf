import { describe, expect, it } from 'vitest';
import { singularValues } from '../../src/network/linalg.js';
import { passivity, reciprocity } from '../../src/network/quality.js';
import { causalityMetric, ieee370Quality, passivityMetric, reciprocityMetric } from '../../src/network/ieee370.js';
import { expectClose, networkOf, cx, polar } from '../helpers.js';

const h = Math.SQRT1_2;

describe('passivity and reciprocity', () => {
  it('ideal Wilkinson (−j/√2)[[0,1,1],[1,0,0],[1,0,0]]: singular values 1, 1, 0 (Wilkinson S-matrix: Pozar, Microwave Engineering, ch. 7, from memory; its singular values by hand: SᴴS = diag(1, ½·[[1,1],[1,1]]))', () => {
    const net = networkOf([1e9], 50, () => [
      [cx(0), cx(0, -h), cx(0, -h)],
      [cx(0, -h), cx(0), cx(0)],
      [cx(0, -h), cx(0), cx(0)],
    ]);
    const sv = singularValues(net.s, 0, 3);
    expectClose(sv[0], 1, 1e-12);
    expectClose(sv[1], 1, 1e-12);
    expectClose(sv[2], 0, 1e-7); // the square root of an eigenvalue at round-off
    expect(passivity(net).passive).toBe(true);
    expect(reciprocity(net).reciprocal).toBe(true);
  });

  it('an ideal circulator (S13 = S21 = S32 = 1) is lossless and not reciprocal (Pozar §9.x, from memory)', () => {
    const net = networkOf([1e9, 2e9], 50, () => [
      [cx(0), cx(0), cx(1)],
      [cx(1), cx(0), cx(0)],
      [cx(0), cx(1), cx(0)],
    ]);
    const p = passivity(net);
    expectClose(p.max, 1, 1e-12, 'largest singular value');
    for (const v of singularValues(net.s, 0, 3)) expectClose(v, 1, 1e-12, 'lossless: all singular values 1');
    const r = reciprocity(net);
    expect(r.reciprocal).toBe(false);
    expectClose(r.maxDeviation, 1, 1e-15);
    expect(r.pair).toEqual([2, 1]);
  });

  it('an amplifier with 10 dB gain is not passive, and says where', () => {
    const net = networkOf([1e9, 2e9, 3e9], 50, (f) => [
      [cx(0.1), cx(0.01)],
      [cx(f === 2e9 ? 3.5 : 3), cx(0.2)],
    ]);
    const p = passivity(net);
    expect(p.passive).toBe(false);
    expect(p.atHz).toBe(2e9);
  });

  it('a 1-port: reciprocity does not apply', () => {
    const net = networkOf([1e9], 50, () => [[cx(0.5)]]);
    expect(reciprocity(net).pair).toBeNull();
    expect(reciprocityMetric(net)).toBeNull();
    expectClose(passivity(net).max, 0.5, 1e-15);
  });
});

describe("IEEE Std 370-2020 quality metrics (values computed by hand with the algorithm of the standard's open reference code: an ideal delay line scores 100/100/100, the same line advanced in time has causality 0)", () => {
  const freqs = Array.from({ length: 200 }, (_, k) => 50e6 * (k + 1));
  const delayLine = (tau: number) =>
    networkOf(freqs, 50, (f) => {
      const t = polar(1, -360 * f * tau);
      return [
        [cx(0), t],
        [t, cx(0)],
      ];
    });

  it('an ideal 1 ns line scores 100 / 100 / 100', () => {
    const q = ieee370Quality(delayLine(1e-9));
    expectClose(q.passivity.score, 100, 1e-9);
    expect(q.passivity.grade).toBe('Good');
    expectClose((q.reciprocity as { score: number }).score, 100, 1e-9);
    expectClose((q.causality as { score: number }).score, 100, 1e-9);
  });

  it('the same line with a time advance has causality 0 (Poor)', () => {
    const c = causalityMetric(delayLine(-1e-9));
    expectClose((c as { score: number }).score, 0, 1e-9);
    expect(c?.grade).toBe('Poor');
  });

  it('passivity weights: |S21| = 1.05 at every point gives PW = 0.4999, PQM = 50.01 (Poor)', () => {
    // PM = 1.05, PW = (1.05 − 1.00001)/0.1 = 0.49990; PQM = (N − 0.4999·N)/N·100 = 50.01
    const g = delayLine(1e-9);
    const s = g.s.map((v) => v * 1.05);
    const m = passivityMetric({ ...g, s });
    expectClose(m.score, (1 - (1.05 - 1.00001) / 0.1) * 100, 1e-9);
    expect(m.grade).toBe('Poor');
  });

  it('reciprocity metric of a circulator: RM = Σ|Sij − Sji| / (P(P−1)) = 6/6 = 1, so RQM = 0', () => {
    const net = networkOf([1e9, 2e9], 50, () => [
      [cx(0), cx(0), cx(1)],
      [cx(1), cx(0), cx(0)],
      [cx(0), cx(1), cx(0)],
    ]);
    expectClose((reciprocityMetric(net) as { score: number }).score, 0, 1e-12);
  });
});
