/**
 * Figures of ideal and textbook networks against handbook values. Sources are
 * named beside each check; "from memory" marks values recalled rather than
 * looked up.
 */
import { describe, expect, it } from 'vitest';
import { expectClose, evaluateYaml, networkOf, partYaml, resultsOf, cx, polar, type Matrix } from '../helpers.js';

const F = [1e9, 1.5e9, 2e9];
const h = Math.SQRT1_2;
const band = '  b: {from: 1 GHz, to: 2 GHz}';
const one = (m: Matrix) => networkOf(F, 50, () => m);
const first = (yaml: string, nets: Record<string, ReturnType<typeof one>>) => resultsOf(yaml, nets).results;

describe('ideal Wilkinson divider S = (−j/√2)[[0,1,1],[1,0,0],[1,0,0]] (Pozar §7.3, from memory)', () => {
  const w = one([
    [cx(0), cx(0, -h), cx(0, -h)],
    [cx(0, -h), cx(0), cx(0)],
    [cx(0, -h), cx(0), cx(0)],
  ]);
  const r = first(
    partYaml({
      cls: 'divider',
      units: ['U1'],
      bands: band,
      limits: [
        '  - {figure: insertion-loss, on: [S21, S31], band: b, max: 3.5 dB}',
        '  - {figure: excess-loss, on: [S21, S31], band: b, max: 0.5 dB}',
        '  - {figure: amplitude-balance, on: [S21, S31], band: b, tolerance: 0.2 dB}',
        '  - {figure: phase-balance, on: [S21, S31], band: b, tolerance: 2 deg}',
        '  - {figure: isolation, on: S32, band: b, min: 20 dB}',
      ].join('\n'),
    }),
    { U1: w },
  );
  it('insertion loss 10·log10 2 = 3.0103 dB, excess loss 0, balances 0', () => {
    expectClose(r[0].worst, 10 * Math.log10(2), 1e-12, 'IL');
    expectClose(r[0].worst, 3.0103, 5e-5, 'IL (10·log10 2 = 3.0103 dB, common practice)');
    expectClose(r[1].worst, 0, 1e-12, 'excess loss');
    expectClose(r[2].worst, 0, 1e-12, 'amplitude balance');
    expect(r[2].limit).toEqual({ nominal: 0, tolerance: 0.2 }); // nominal defaulted to 0 and echoed
    expectClose(r[3].worst, 0, 1e-12, 'phase balance');
    expect(r[4].worst).toBe(Infinity); // S32 = 0: infinite isolation
  });
});

describe('90° and 180° hybrids (Pozar §7.5 and §7.8, from memory)', () => {
  // branch-line (−1/√2)[[0,j,1,0],[j,0,0,1],[1,0,0,j],[0,1,j,0]]: S21 = −j/√2 (∠−90°), S31 = −1/√2 (∠180°)
  const bl = one([
    [cx(0), cx(0, -h), cx(-h), cx(0)],
    [cx(0, -h), cx(0), cx(0), cx(-h)],
    [cx(-h), cx(0), cx(0), cx(0, -h)],
    [cx(0), cx(-h), cx(0, -h), cx(0)],
  ]);
  // rat-race (−j/√2)[[0,1,1,0],[1,0,0,−1],[1,0,0,1],[0,−1,1,0]]
  const rr = one([
    [cx(0), cx(0, -h), cx(0, -h), cx(0)],
    [cx(0, -h), cx(0), cx(0), cx(0, h)],
    [cx(0, -h), cx(0), cx(0), cx(0, -h)],
    [cx(0), cx(0, h), cx(0, -h), cx(0)],
  ]);

  it('branch-line: phase balance 90° (∠S21 − ∠S31 = −270°, wrapped around the 90° nominal), amplitude balance 0', () => {
    const r = first(
      partYaml({
        cls: 'hybrid',
        units: ['U1'],
        bands: band,
        limits:
          '  - {figure: phase-balance, on: [S21, S31], band: b, tolerance: 5 deg}\n  - {figure: amplitude-balance, on: [S21, S31], band: b, tolerance: 0.5 dB}',
      }),
      { U1: bl },
    );
    expect(r[0].limit).toEqual({ nominal: 90, tolerance: 5 });
    expectClose(r[0].worst, 90, 1e-12, 'phase balance');
    expectClose(r[1].worst, 0, 1e-12, 'amplitude balance');
  });

  it("rat-race: 180° between the Δ port's outputs (S24, S34), 0° between the Σ port's (S21, S31)", () => {
    const yaml = partYaml({
      cls: 'hybrid',
      units: ['U1'],
      bands: band,
      extra: 'phase-split: 180 deg\n',
      limits:
        '  - {figure: phase-balance, on: [S24, S34], band: b, tolerance: 5 deg}\n  - {figure: phase-balance, on: [S21, S31], band: b, nominal: 0 deg, tolerance: 5 deg}',
    });
    const r = first(yaml, { U1: rr });
    expectClose(r[0].worst, 180, 1e-12, 'Δ outputs');
    expectClose(r[1].worst, 0, 1e-12, 'Σ outputs');
  });

  it('the wrap across ±180°: ∠A − ∠B = −179° and +179° both read 181° and 179° around a 180° nominal', () => {
    const net = networkOf([1e9, 2e9], 50, (f) => {
      const d = f === 1e9 ? -179 : 179;
      return [
        [cx(0), cx(0), cx(0)],
        [polar(0.7, d / 2), cx(0), cx(0)],
        [polar(0.7, -d / 2), cx(0), cx(0)],
      ];
    });
    const r = first(partYaml({ cls: 'balun', units: ['U1'], bands: band, limits: '  - {figure: phase-balance, on: [S21, S31], band: b, tolerance: 2 deg}' }), {
      U1: net,
    });
    expect(r[0].units[0].worst).toBeCloseTo(181, 12); // furthest from 180 at the first point (tie → lowest frequency)
    expect(r[0].worstAtHz).toBe(1e9);
    expect(r[0].margin).toBeCloseTo(1, 12);
  });
});

describe('couplers (definitions: C = −20·log10|S31|, I = −20·log10|S41|, D = I − C; common practice)', () => {
  // a 20 dB coupler with 60 dB isolation: directivity 40 dB; ideal mainline loss −10·log10(1 − 10^(−C/10)) = 0.0436 dB (power conservation of a lossless coupler, computed by hand)
  const c = 0.1,
    iso = 0.001,
    t = Math.sqrt(1 - c * c);
  const net = one([
    [cx(0), cx(t), cx(c), cx(iso)],
    [cx(t), cx(0), cx(iso), cx(c)],
    [cx(c), cx(iso), cx(0), cx(t)],
    [cx(iso), cx(c), cx(t), cx(0)],
  ]);
  const r = first(
    partYaml({
      cls: 'coupler',
      units: ['U1'],
      bands: band,
      limits:
        '  - {figure: coupling, on: S31, band: b, nominal: 20 dB, tolerance: 0.5 dB}\n  - {figure: directivity, on: [S31, S41], band: b, min: 30 dB}\n  - {figure: mainline-loss, on: S21, band: b, max: 0.1 dB}\n  - {figure: isolation, on: S41, band: b, min: 50 dB}',
    }),
    { U1: net },
  );
  it('coupling 20 dB, directivity = isolation − coupling = 40 dB, mainline loss 0.0436 dB', () => {
    expectClose(r[0].worst, 20, 1e-12, 'coupling');
    expectClose(r[1].worst, r[3].worst - r[0].worst, 1e-12, 'D = I − C');
    expectClose(r[1].worst, 40, 1e-12, 'directivity');
    expectClose(r[2].worst, 0.0436, 5e-5, 'mainline loss');
  });
});

describe('VSWR ↔ return loss (common practice: RL 20 dB ↔ VSWR 1.222, RL 10 dB ↔ 1.925)', () => {
  it('gives both values', () => {
    const g = (rl: number) => Math.pow(10, -rl / 20);
    const net = networkOf([1e9, 2e9], 50, (f) => [[cx(f === 1e9 ? g(20) : g(10))]]);
    const yaml = `part: T\nclass: generic\nmeasurements:\n  - {unit: U, file: u.s1p}\nbands:\n  lo: {from: 1 GHz, to: 1 GHz}\n  hi: {from: 2 GHz, to: 2 GHz}\nlimits:\n  - {figure: vswr, on: S11, band: lo, max: 1.5}\n  - {figure: vswr, on: S11, band: hi, max: 2}\n  - {figure: return-loss, on: S11, band: hi, min: 9.5 dB}\n`;
    const r = resultsOf(yaml, { U: net }).results;
    expectClose(r[0].worst, 1.222, 5e-4, 'VSWR at RL 20 dB');
    expectClose(r[1].worst, 1.925, 5e-4, 'VSWR at RL 10 dB');
    expectClose(r[2].worst, 10, 1e-12, 'RL');
  });
});

describe('stability (textbook worked examples, from memory: Gonzalez, Microwave Transistor Amplifiers, ch. 3)', () => {
  const amp = (s11: [number, number], s21: [number, number], s12: [number, number], s22: [number, number]) =>
    networkOf(F, 50, () => [
      [polar(...s11), polar(...s12)],
      [polar(...s21), polar(...s22)],
    ]);
  const yaml = partYaml({
    cls: 'amplifier',
    units: ['U1'],
    bands: band,
    limits: '  - {figure: stability-k, band: b, min: 1}\n  - {figure: stability-delta, band: b, max: 1}\n  - {figure: stability-mu, band: b, min: 1}',
  });

  it('S11 = 0.894∠−60.6°, S21 = 3.122∠123.6°, S12 = 0.020∠62.4°, S22 = 0.781∠−27.6°: |Δ| ≈ 0.696, K ≈ 0.607 (potentially unstable)', () => {
    const r = first(yaml, { U1: amp([0.894, -60.6], [3.122, 123.6], [0.02, 62.4], [0.781, -27.6]) });
    expectClose(r[0].worst, 0.607, 5e-4, 'K');
    expectClose(r[1].worst, 0.696, 5e-4, '|Δ|');
    expect(r[0].pass).toBe(false);
    expect(r[2].worst).toBeLessThan(1); // μ agrees: not unconditionally stable
    expect(r[0].on).toEqual(['S11', 'S21', 'S12', 'S22']);
  });

  it('S11 = 0.72∠−116°, S21 = 2.60∠76°, S12 = 0.03∠57°, S22 = 0.73∠−54°: K ≈ 1.195, |Δ| ≈ 0.488 (unconditionally stable)', () => {
    const r = first(yaml, { U1: amp([0.72, -116], [2.6, 76], [0.03, 57], [0.73, -54]) });
    expectClose(r[0].worst, 1.195, 5e-4, 'K');
    expectClose(r[1].worst, 0.488, 5e-4, '|Δ|');
    expect(r[0].pass && r[1].pass && r[2].pass).toBe(true); // μ > 1 too (Edwards & Sinsky: equivalent test)
  });

  it('μ of a unilateral amplifier (S12 = 0) is 1/|S22|: the formula with Δ = S11·S22', () => {
    const r = first(partYaml({ cls: 'amplifier', units: ['U1'], bands: band, limits: '  - {figure: stability-mu, band: b, min: 1}' }), {
      U1: amp([0.5, 30], [4, 100], [0, 0], [0.8, -40]),
    });
    expectClose(r[0].worst, 1 / 0.8, 1e-12, 'μ');
  });

  it('K where S12·S21 = 0 is reported as not defined, never as infinity passing', () => {
    const r = evaluateYaml(yaml, { U1: amp([0.5, 30], [4, 100], [0, 0], [0.8, -40]) });
    expect(r.result).toBeNull();
    expect(r.errors[0].code).toBe('figure-undefined');
    expect(r.errors[0].message).toContain(
      'stability-k on S11/S21/S12/S22 in unit U1 (U1.s4p) has no value at 1 GHz: S12·S21 = 0 at 1 GHz (no reverse transmission), where K has no value; stability-mu is defined there (μ = 1.25)',
    );
  });

  it('where S12·S21 = 0 and |S11| = 1, the K message does not send the reader to μ, which has no value there either', () => {
    const r = evaluateYaml(yaml, { U1: amp([1, 30], [4, 100], [0, 0], [0.8, -40]) });
    expect(r.errors[0].message).toContain('where K has no value; stability-mu has none there either');
  });

  /*
   * A lossless ladder: a 5-pole Butterworth lowpass at 1 GHz (g = 0.618, 1.618, 2, 1.618, 0.618;
   * series L = g·Z0/ωc, shunt C = g/(Z0·ωc), Matthaei, Young & Jones, from memory), its S from the
   * chain (ABCD) matrix (Pozar table 4.2, from memory) up to 80 GHz, where |S21| ≈ 3e-10. Any
   * lossless reciprocal 2-port has K = 1, |Δ| = 1 and μ = 1 at every frequency (S unitary: K's
   * numerator is 2|S12·S21|); written as 1 − |S11|² − |S22|² + |Δ|², K cancels there to noise.
   */
  it('a lossless ladder has K = 1 and |Δ| = 1 at every point, deep into the stopband (the textbook form gave K = −388 here)', () => {
    const Z0 = 50,
      wc = 2 * Math.PI * 1e9,
      g = [0.618, 1.618, 2, 1.618, 0.618];
    const freqs = Array.from({ length: 121 }, (_, k) => 1e8 * Math.pow(800, k / 120));
    type C = [number, number];
    const mul = (a: C, b: C): C => [a[0] * b[0] - a[1] * b[1], a[0] * b[1] + a[1] * b[0]];
    const add = (a: C, b: C): C => [a[0] + b[0], a[1] + b[1]];
    const div = (a: C, b: C): C => {
      const d = b[0] * b[0] + b[1] * b[1];
      return [(a[0] * b[0] + a[1] * b[1]) / d, (a[1] * b[0] - a[0] * b[1]) / d];
    };
    const chain = (m: C[][], n: C[][]): C[][] => [
      [add(mul(m[0][0], n[0][0]), mul(m[0][1], n[1][0])), add(mul(m[0][0], n[0][1]), mul(m[0][1], n[1][1]))],
      [add(mul(m[1][0], n[0][0]), mul(m[1][1], n[1][0])), add(mul(m[1][0], n[0][1]), mul(m[1][1], n[1][1]))],
    ];
    let deepest = 1;
    const net = networkOf(freqs, Z0, (f) => {
      const w = 2 * Math.PI * f;
      let abcd: C[][] = [
        [
          [1, 0],
          [0, 0],
        ],
        [
          [0, 0],
          [1, 0],
        ],
      ];
      g.forEach((gk, k) => {
        const el: C[][] =
          k % 2 === 0
            ? [
                [
                  [1, 0],
                  [0, (w * gk * Z0) / wc],
                ],
                [
                  [0, 0],
                  [1, 0],
                ],
              ]
            : [
                [
                  [1, 0],
                  [0, 0],
                ],
                [
                  [0, (w * gk) / (Z0 * wc)],
                  [1, 0],
                ],
              ];
        abcd = chain(abcd, el);
      });
      const [[A, B], [Cc, D]] = abcd;
      const bz = div(B, [Z0, 0]),
        cz = mul(Cc, [Z0, 0]);
      const den = add(add(A, bz), add(cz, D));
      const s11 = div([A[0] + bz[0] - cz[0] - D[0], A[1] + bz[1] - cz[1] - D[1]], den);
      const s22 = div([-A[0] + bz[0] - cz[0] + D[0], -A[1] + bz[1] - cz[1] + D[1]], den);
      const s21 = div([2, 0], den);
      deepest = Math.min(deepest, Math.hypot(...s21));
      return [
        [s11, s21],
        [s21, s22],
      ];
    });
    expect(deepest).toBeLessThan(1e-9);
    const wide = '  b: {from: 100 MHz, to: 80 GHz}';
    const r = first(
      partYaml({
        cls: 'filter',
        units: ['U1'],
        bands: wide,
        limits: '  - {figure: stability-k, band: b, min: 1}\n  - {figure: stability-delta, band: b, max: 1.000001}',
      }),
      { U1: net },
    );
    expectClose(r[0].worst, 1, 1e-9, 'K of a lossless network (worst over 0.1–80 GHz)');
    expectClose(r[1].worst, 1, 1e-12, '|Δ| of a lossless network');
    // μ = (1 − |S11|²)/…: its numerator is resolved to about 1e-16 only, so μ is checked where |S21|² ≥ 1e-6
    const pass = first(
      partYaml({ cls: 'filter', units: ['U1'], bands: '  b: {from: 100 MHz, to: 3 GHz}', limits: '  - {figure: stability-mu, band: b, min: 0.5}' }),
      { U1: net },
    );
    expectClose(pass[0].worst, 1, 1e-9, 'μ of a lossless network up to 3 GHz (|S21| there ≈ 4e-3)');
  });

  it('other port pairs: ports: [3, 1] reads S33, S13, S31, S11', () => {
    const r = first(partYaml({ cls: 'amplifier', units: ['U1'], bands: band, limits: '  - {figure: stability-k, ports: [3, 1], band: b, min: 1}' }), {
      U1: networkOf(F, 50, () => [
        [polar(0.73, -54), cx(0), polar(2.6, 76)],
        [cx(0), cx(0), cx(0)],
        [polar(0.03, 57), cx(0), polar(0.72, -116)],
      ]),
    });
    expect(r[0].on).toEqual(['S33', 'S13', 'S31', 'S11']);
    expectClose(r[0].worst, 1.195, 5e-4, 'K');
  });
});

describe('dividers, delay, flatness', () => {
  it('one measured point has no group delay, and the error says why (a derivative needs two frequencies); a band no file covers is said once for two limits', () => {
    const single = networkOf([2.4e9], 50, () => [
      [cx(0.1), polar(0.9, -30)],
      [polar(0.9, -30), cx(0.1)],
    ]);
    const r = evaluateYaml(
      partYaml({ units: ['U1'], bands: '  b: {from: 2.4 GHz, to: 2.4 GHz}', limits: '  - {figure: group-delay, on: S21, band: b, max: 20 ns}' }),
      { U1: single },
    );
    expect(r.errors[0].message).toBe(
      'group-delay on S21 in unit U1 (U1.s4p): group delay is the derivative of the phase over frequency, and a file of 1 measured point has none; it needs at least two frequencies',
    );
    const wide = evaluateYaml(
      partYaml({
        units: ['U1'],
        bands: '  b: {from: 2.3 GHz, to: 2.5 GHz}',
        limits: '  - {figure: group-delay, on: S21, band: b, max: 20 ns}\n  - {figure: insertion-loss, on: S21, band: b, max: 2 dB}',
      }),
      { U1: single },
    );
    expect(wide.errors).toHaveLength(1);
    expect(wide.errors[0].code).toBe('band-outside-data');
  });

  it('4-way divider at 6.5 dB: excess loss 6.5 − 10·log10 4 = 0.479 dB (the definition of excess loss, common practice; computed by hand)', () => {
    const t = Math.pow(10, -6.5 / 20);
    const z = cx(0),
      s = cx(t);
    const net = one([
      [z, s, s, s, s],
      [s, z, z, z, z],
      [s, z, z, z, z],
      [s, z, z, z, z],
      [s, z, z, z, z],
    ]);
    const r = first(partYaml({ cls: 'divider', units: ['U1'], bands: band, limits: '  - {figure: excess-loss, on: [S21, S51], band: b, max: 1 dB}' }), {
      U1: net,
    });
    expectClose(r[0].worst, 0.479, 5e-4, 'excess loss');
  });

  it('a 1 m air line: group delay 3.33564 ns = l/c, variation 0 (c by the SI definition)', () => {
    const freqs = Array.from({ length: 101 }, (_, k) => 1e9 + k * 1e7);
    const net = networkOf(freqs, 50, (f) => {
      const t = polar(1, (-360 * f) / 299_792_458);
      return [
        [cx(0), t],
        [t, cx(0)],
      ];
    });
    const r = first(
      partYaml({
        units: ['U1'],
        bands: band,
        limits: '  - {figure: group-delay, on: S21, band: b, max: 4 ns}\n  - {figure: group-delay-variation, on: S21, band: b, max: 0.1 ns}',
      }),
      { U1: net },
    );
    expectClose(r[0].worst, 3.33564e-9, 1e-14, 'τ');
    expect(r[0].limit).toEqual({ max: 4e-9 }); // "4 ns" in YAML is 4e-9 s in results
    expectClose(r[1].worst, 0, 1e-17, 'variation');
    expect(r[1].worstAtHz).toBeNull();
  });

  it('flatness figures are peak-to-peak: gain sloping from 10 to 12 dB has gain flatness 2 dB', () => {
    const net = networkOf([1e9, 1.5e9, 2e9], 50, (f) => {
      const g = Math.pow(10, (10 + (2 * (f - 1e9)) / 1e9) / 20);
      return [
        [cx(0.1), cx(0.01)],
        [cx(g), cx(0.1)],
      ];
    });
    const r = first(
      partYaml({
        cls: 'amplifier',
        units: ['U1'],
        bands: band,
        limits: '  - {figure: gain-flatness, on: S21, band: b, max: 3 dB}\n  - {figure: gain, on: S21, band: b, min: 9 dB}',
      }),
      { U1: net },
    );
    expectClose(r[0].worst, 2, 1e-12, 'gain flatness');
    expectClose(r[1].worst, 10, 1e-12, 'lowest gain');
    expect(r[1].worstAtHz).toBe(1e9);
  });

  it('bandwidth and centre frequency at 3 dB below the best insertion loss, edges interpolated linearly', () => {
    // IL(f) = 1 dB + 2 dB per 100 MHz away from 2 GHz, on a 50 MHz grid: the 4 dB points are at 1.85 and 2.15 GHz,
    // between grid points, found exactly since IL is linear between neighbours.
    const freqs = Array.from({ length: 41 }, (_, k) => 1e9 + k * 5e7);
    const net = networkOf(freqs, 50, (f) => {
      const il = 1 + (2 * Math.abs(f - 2e9)) / 1e8;
      return [
        [cx(0), cx(0)],
        [cx(Math.pow(10, -il / 20)), cx(0)],
      ];
    });
    const yaml = `part: T\nclass: filter\nmeasurements:\n  - {unit: U, file: u.s2p}\nbands:\n  pass: {from: 1.9 GHz, to: 2.1 GHz}\nlimits:\n  - {figure: bandwidth, on: S21, band: pass, min: 250 MHz}\n  - {figure: center-frequency, on: S21, band: pass, tolerance: 10 MHz}\n  - {figure: bandwidth, on: S21, band: pass, level: 1 dB, min: 90 MHz}\n`;
    const r = resultsOf(yaml, { U: net }).results;
    expectClose(r[0].worst, 3e8, 1e-3, 'bandwidth at 3 dB');
    expectClose(r[1].worst, 2e9, 1e-3, 'centre');
    expect(r[1].limit).toEqual({ nominal: 2e9, tolerance: 1e7 }); // nominal defaults to the band centre
    expectClose(r[2].worst, 1e8, 1e-3, 'bandwidth at 1 dB');
    expect(r[0].unit).toBe('Hz');
  });
});

describe('custom figures', () => {
  const c = 0.1,
    iso = 0.001;
  const net = one([
    [cx(0), cx(0.99), cx(c), cx(iso)],
    [cx(0.99), cx(0), cx(iso), cx(c)],
    [cx(c), cx(iso), cx(0), cx(0.99)],
    [cx(iso), cx(c), cx(0.99), cx(0)],
  ]);
  const withCustom = (expr: string, limit = '  - {figure: coupled-minus-isolated, band: b, min: 30 dB}') =>
    partYaml({
      cls: 'coupler',
      units: ['U1'],
      bands: band,
      limits: limit,
      extra: `custom-figures:\n  coupled-minus-isolated: {expression: "${expr}", unit: dB, worse: lower}\n`,
    });

  it('db(S31) - db(S41) equals the directivity', () => {
    const r = first(withCustom('db(S31) - db(S41)'), { U1: net });
    expectClose(r[0].worst, 40, 1e-12);
    expect(r[0].on).toEqual(['S31', 'S41']);
  });

  it('* and ^ act point by point', () => {
    const r = first(withCustom('magnitude(S31)^2 * 100 + 0 * db(S21)', '  - {figure: coupled-minus-isolated, band: b, max: 2 dB}'), { U1: net });
    expectClose(r[0].worst, 1, 1e-12);
  });

  it('unknown names and bare S-parameters get a clear error at the expression', () => {
    const a = evaluateYaml(withCustom('db(S31) - loss(S41)'), { U1: net });
    expect(a.errors[0]).toMatchObject({ code: 'bad-expression', line: 11 });
    expect(a.errors[0].message).toContain('unknown function loss()');
    const b = evaluateYaml(withCustom('db(S31) - S41'), { U1: net });
    expect(b.errors[0].message).toContain('S41 is complex: wrap it in a trace function such as db(S41)');
    const c2 = evaluateYaml(withCustom('db(S31) - offset'), { U1: net });
    expect(c2.errors[0].message).toContain('unknown name "offset"');
  });
});

describe('more level figures against their definitions', () => {
  it('mismatch loss: RL 10 dB → 0.458 dB, RL 20 dB → 0.0436 dB (−10·log10(1 − |Γ|²), computed by hand; 10 dB ↔ 10 %, 20 dB ↔ 1 % reflected power is common practice)', () => {
    const g = (rl: number) => Math.pow(10, -rl / 20);
    const net = networkOf([1e9, 2e9], 50, (f) => [[cx(f === 1e9 ? g(10) : g(20))]]);
    const yaml = `part: T\nclass: generic\nmeasurements:\n  - {unit: U, file: u.s1p}\nbands:\n  lo: {from: 1 GHz, to: 1 GHz}\n  hi: {from: 2 GHz, to: 2 GHz}\nlimits:\n  - {figure: mismatch-loss, on: S11, band: lo, max: 1 dB}\n  - {figure: mismatch-loss, on: S11, band: hi, max: 1 dB}\n`;
    const r = resultsOf(yaml, { U: net }).results;
    expectClose(r[0].worst, 0.458, 5e-4, 'ML at RL 10 dB');
    expectClose(r[1].worst, 0.0436, 5e-5, 'ML at RL 20 dB');
  });

  it('coupling flatness and passband ripple are the peak-to-peak of −20·log10|X|: 19.5…20.7 dB → 1.2 dB', () => {
    const levels = [20, 19.5, 20.7, 20.1];
    const net = networkOf([1e9, 1.3e9, 1.6e9, 2e9], 50, (_, k) => [
      [cx(0), cx(0)],
      [cx(Math.pow(10, -levels[k] / 20)), cx(0)],
    ]);
    const r = first(
      partYaml({
        units: ['U1'],
        bands: band,
        limits: '  - {figure: coupling-flatness, on: S21, band: b, max: 2 dB}\n  - {figure: passband-ripple, on: S21, band: b, max: 2 dB}',
      }),
      { U1: net },
    );
    expectClose(r[0].worst, 1.2, 1e-12, 'coupling flatness');
    expectClose(r[1].worst, 1.2, 1e-12, 'ripple');
  });

  it('group delay variation of a dispersive phase φ = −360·(τ0·f + a·f²): τ = τ0 + 2a·f, so GDV over [f1, f2] = 2a·(f2 − f1)', () => {
    // central differences are exact on a quadratic at interior points; the band avoids the one-sided ends
    const tau0 = 2e-9,
      a = 1e-19; // 0.2 ns of extra delay per GHz
    const freqs = Array.from({ length: 51 }, (_, k) => 0.5e9 + k * 5e7);
    const net = networkOf(freqs, 50, (f) => {
      const t = polar(1, -360 * (tau0 * f + a * f * f));
      return [
        [cx(0), t],
        [t, cx(0)],
      ];
    });
    const r = first(
      partYaml({
        units: ['U1'],
        bands: band,
        limits: '  - {figure: group-delay-variation, on: S21, band: b, max: 1 ns}\n  - {figure: group-delay, on: S21, band: b, max: 3 ns}',
      }),
      { U1: net },
    );
    expectClose(r[0].worst, 2 * a * 1e9, 1e-15, 'GDV');
    expectClose(r[1].worst, tau0 + 2 * a * 2e9, 1e-15, 'largest τ at 2 GHz');
    expect(r[1].worstAtHz).toBe(2e9);
  });
});

describe('every component class evaluates', () => {
  const classes = ['filter', 'attenuator', 'amplifier', 'divider', 'coupler', 'hybrid', 'circulator', 'isolator', 'cable', 'switch', 'balun', 'generic'];
  it.each(classes)('%s', (cls) => {
    const net = one([
      [cx(0.1), cx(0.5)],
      [cx(0.5), cx(0.1)],
    ]);
    const r = first(
      partYaml({
        cls,
        units: ['U1'],
        bands: band,
        limits: '  - {figure: insertion-loss, on: S21, band: b, max: 7 dB}\n  - {figure: return-loss, on: [S11, S22], band: b, min: 15 dB}',
      }),
      { U1: net },
    );
    expectClose(r[0].worst, -20 * Math.log10(0.5), 1e-12);
    expect(r[1].pass).toBe(true);
  });
});

describe('mixed-mode parameters in part files (Bockelman & Eisenstadt 1995; pairs (1,2) in, (3,4) out)', () => {
  // two coupled-free lines 1→3 and 2→4, the second 10 % stronger: Sdd21 = ½(S31 − S32 − S41 + S42) = t(1 + 0.05),
  // Scc21 = ½(S31 + S32 + S41 + S42) = t(1 + 0.05), Sdc21 = ½(S31 + S32 − S41 − S42) = −0.05·t
  const t = 0.8,
    k = 1.1;
  const z = cx(0);
  const net = one([
    [z, z, cx(t), z],
    [z, z, z, cx(t * k)],
    [cx(t), z, z, z],
    [z, cx(t * k), z, z],
  ]);
  const yaml = (on: string, extra = 'mixed-mode: {pairs: [[1, 2], [3, 4]]}\n') =>
    partYaml({ cls: 'generic', units: ['U1'], bands: band, extra, limits: `  - {figure: insertion-loss, on: ${on}, band: b, max: 3 dB}` });

  it('Sdd21 and Scc21: the differential and common transmission', () => {
    const dd = first(yaml('Sdd21'), { U1: net });
    expectClose(dd[0].worst, -20 * Math.log10(t * (1 + (k - 1) / 2)), 1e-12, 'Sdd21 loss');
    expect(dd[0].on).toEqual(['Sdd21']);
    const cc = first(yaml('Scc21'), { U1: net });
    expectClose(cc[0].worst, -20 * Math.log10(t * (1 + (k - 1) / 2)), 1e-12, 'Scc21 loss');
  });

  it('Sdc21: mode conversion from the imbalance', () => {
    const dc = first(yaml('Sdc21'), { U1: net });
    expectClose(dc[0].worst, -20 * Math.log10((t * (k - 1)) / 2), 1e-12, 'Sdc21 loss');
  });

  it("without the part's port pairs, a mixed-mode parameter is an error at its position", () => {
    const r = evaluateYaml(yaml('Sdd21', ''), { U1: net });
    expect(r.errors[0]).toMatchObject({ code: 'bad-parameter' });
    expect(r.errors[0].message).toContain('add mixed-mode: {pairs: [[1, 2], [3, 4]]}');
  });
});
