/**
 * Comparison files read like part files: YAML 1.2, every mistake at its line
 * and column with what was expected, all at once. The requirement is read by
 * the part file's own rules (the same figure names, units and messages).
 */
import { describe, expect, it } from 'vitest';
import { loadComparisonText, parseOhms } from '../../src/part-file/comparison.js';

const BASE = `title: Shortlist
reference: 50 ohm
bands: {use: {from: 2.40 GHz, to: 2.48 GHz}}
limits:
  - {figure: insertion-loss, on: S21, band: use, max: 1.5 dB}
  - {figure: return-loss, on: [S11, S22], band: use, min: 15 dB}
candidates:
  - {label: Ours, part: ../parts/vt-bpf-2450/part.yaml}
  - {label: Vendor B, files: [b/unit1.s2p, b/unit2.s2p], ports: {1: 2, 2: 1}}
  - {label: Vendor C, file: c.s2p}
baseline: Ours
`;

const errorsOf = (text: string) => loadComparisonText(text, 'cmp.yaml').errors.map((e) => `${e.line}:${e.column} ${e.message}`);

describe('comparison files', () => {
  it("the example of the issue reads: reference, bands, limits as a part's, candidates with sources and port maps, the baseline", () => {
    const r = loadComparisonText(BASE, 'cmp.yaml');
    expect(r.errors).toEqual([]);
    const c = r.value!;
    expect(c.referenceOhms).toBe(50);
    expect(c.requirement.checks.map((k) => [k.figure.id, k.on, k.band.fromHz, k.band.toHz, k.limit])).toEqual([
      ['insertion-loss', ['S21'], 2.4e9, 2.48e9, { max: 1.5 }],
      ['return-loss', ['S11', 'S22'], 2.4e9, 2.48e9, { min: 15 }],
    ]);
    expect(c.candidates.map((k) => [k.label, k.source.kind, k.portMap])).toEqual([
      ['Ours', 'part', null],
      ['Vendor B', 'files', [2, 1]],
      ['Vendor C', 'files', null],
    ]);
    expect(c.baseline).toBe('Ours');
  });

  it('reference: "50 ohm", "75 Ω", 50, "50 ohms"; nothing else', () => {
    expect([parseOhms('50 ohm'), parseOhms('75 Ω'), parseOhms(50), parseOhms('50 ohms'), parseOhms('100Ω')]).toEqual([50, 75, 50, 50, 100]);
    expect([parseOhms('-50 ohm'), parseOhms('0'), parseOhms('fifty'), parseOhms('50 dB'), parseOhms(true)]).toEqual([null, null, null, null, null]);
    expect(errorsOf(BASE.replace('reference: 50 ohm', 'reference: 50 dB'))).toEqual([
      '2:12 reference "50 dB" is not an impedance; expected a positive number of ohms, e.g. 50 ohm, 75 Ω or 50',
    ]);
  });

  it('unknown keys name the nearest valid one, at their position', () => {
    expect(errorsOf(BASE.replace('baseline: Ours', 'baseline: Ours\ncandiates: []'))).toEqual([
      expect.stringMatching(/^12:1 unknown key "candiates" in the comparison file; did you mean "candidates"\?/),
    ]);
    expect(errorsOf(BASE.replace('{label: Vendor C, file: c.s2p}', '{label: Vendor C, fille: c.s2p}'))).toEqual(
      [
        expect.stringMatching(/^10:23 unknown key "fille" in candidates entry 3; did you mean "file"\?/),
        '10:5 candidate "Vendor C" has no data: give part (a catalog part file), files (its units\' Touchstone files) or file (one)',
      ].sort(),
    );
    // conditions and assurances belong to a vendor's own units: not keys of a requirement
    expect(errorsOf(BASE.replace('max: 1.5 dB}', 'max: 1.5 dB, when: {temperature: 25}}'))).toEqual([expect.stringMatching(/^5:63 unknown key "when"/)]);
  });

  it('a label used twice, a baseline that is no candidate, two sources, a port map with a gap or two ports on one', () => {
    expect(errorsOf(BASE.replace('label: Vendor C', 'label: Vendor B'))).toEqual([
      '10:13 the label "Vendor B" is used twice (candidates 2 and 3); each candidate needs its own',
    ]);
    expect(errorsOf(BASE.replace('baseline: Ours', 'baseline: Theirs'))).toEqual([
      '11:11 baseline "Theirs" is not the label of a candidate; the candidates are "Ours", "Vendor B", "Vendor C"',
    ]);
    expect(errorsOf(BASE.replace('file: c.s2p}', 'file: c.s2p, part: c.yaml}'))).toEqual([
      '10:23 candidate "Vendor C" gives part and file; give one of part (a catalog part file), files (its units\' Touchstone files) or file (one)',
    ]);
    expect(errorsOf(BASE.replace('ports: {1: 2, 2: 1}', 'ports: {1: 2, 2: 2}'))).toEqual([
      '9:75 the port map of "Vendor B" maps our ports 1 and 2 to the same port 2 of the file; each of our ports needs a port of its own',
    ]);
    expect(errorsOf(BASE.replace('ports: {1: 2, 2: 1}', 'ports: {1: 2, 3: 1}'))).toEqual([
      '9:65 the port map of "Vendor B" skips our port 2; our ports are numbered 1 to 3 without gaps',
    ]);
    expect(errorsOf(BASE.replace('part: ../parts/vt-bpf-2450/part.yaml}', 'part: ../parts/vt-bpf-2450/part.yaml, ports: {1: 1, 2: 2}}'))).toEqual([
      expect.stringMatching(/^8:57 candidate "Ours" is a catalog part: its ports are numbered by its part file/),
    ]);
  });

  it("the requirement is read by the part file's rules: an unknown figure, a band not defined, a value without its unit — all at once, in line order", () => {
    const text = BASE.replace('figure: insertion-loss', 'figure: insertion-los').replace('band: use, min: 15 dB', 'band: usa, min: 15');
    expect(errorsOf(text)).toEqual([
      '5:14 unknown figure "insertion-los"; did you mean "insertion-loss"?',
      '6:49 band "usa" is not defined; did you mean "use"?',
      '6:59 min 15 of return-loss has no unit; return-loss is in dB: write 15 dB',
    ]);
  });

  it('an empty file and YAML syntax errors are positioned', () => {
    expect(errorsOf('')).toEqual(['0:0 the comparison file is empty; it needs title, bands, limits and candidates']);
    expect(errorsOf('title: [unclosed\n')[0]).toMatch(/^\d+:\d+ YAML syntax/);
  });
});
