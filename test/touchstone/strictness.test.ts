/**
 * The reader's one level of strictness (README, "What the reader accepts"):
 * what the Touchstone File Format Specification 2.0 (IBIS Open Forum) requires
 * but a file can go without while its data stay unambiguous is read, with a
 * warning that names the rule; what leaves the data ambiguous or incomplete is
 * refused, with the line and what was expected.
 */
import { describe, expect, it } from 'vitest';
import { readTouchstone } from '../../src/touchstone/index.js';

const HEAD = '[Version] 2.0\n# GHz S MA R 50\n[Number of Ports] 2\n';
const POINTS = '1 0.5 0 0.4 10 0.3 20 0.2 30\n2 0.5 0 0.4 10 0.3 20 0.2 30\n';

function read(text: string, fileName = 'a.s2p') {
  const r = readTouchstone(text, { fileName });
  return { ...r, codes: r.warnings.map((w) => w.code) };
}

describe('required keywords a file can go without: read, with a warning naming the rule', () => {
  it("a version 2 two-port without [Two-Port Data Order] (as the standard's own Example 20) is read as 21_12, the order version 1 implies", () => {
    const r = read(`${HEAD}[Number of Frequencies] 2\n[Network Data]\n${POINTS}[End]\n`);
    expect(r.errors).toEqual([]);
    expect(r.codes).toEqual(['missing-two-port-order']);
    expect(r.warnings[0]).toMatchObject({ line: 5 });
    expect(r.warnings[0].message).toContain('read as 21_12 (N11 N21 N12 N22)');
    const s = r.value!.network.s;
    // 21_12: the second pair (0.4∠10°) is S21 = s[1][0], the third (0.3∠20°) S12 = s[0][1]
    expect(Math.hypot(s[4], s[5])).toBeCloseTo(0.4, 12);
    expect(Math.hypot(s[2], s[3])).toBeCloseTo(0.3, 12);
    expect(r.value!.info.twoPortOrder).toBe('21_12');
  });

  it('a version 2 file without [End] whose points match [Number of Frequencies]', () => {
    const r = read(`${HEAD}[Two-Port Data Order] 12_21\n[Number of Frequencies] 2\n[Network Data]\n${POINTS}`);
    expect(r.errors).toEqual([]);
    expect(r.codes).toEqual(['missing-end']);
    expect(r.warnings[0].message).toBe(
      'the version 2 file ends at line 8 without [End], which the standard requires; its data hold the 2 points [Number of Frequencies] declares, so they are read',
    );
    expect(r.value!.network.freqHz).toEqual(new Float64Array([1e9, 2e9]));
  });

  it('[Number of Noise Frequencies] without [Noise Data]: the network data are read, without noise parameters', () => {
    const r = read(`${HEAD}[Two-Port Data Order] 12_21\n[Number of Frequencies] 2\n[Number of Noise Frequencies] 3\n[Network Data]\n${POINTS}[End]\n`);
    expect(r.errors).toEqual([]);
    expect(r.codes).toEqual(['missing-noise-data']);
    expect(r.warnings[0].message).toContain('declares 3 noise points, but the file has no [Noise Data]');
    expect(r.value!.noise).toBeNull();
  });
});

describe('what cannot be read unambiguously is refused, saying where the file ends', () => {
  it('a version 2 file cut short: fewer points than declared and no [End]', () => {
    const r = read(`${HEAD}[Two-Port Data Order] 12_21\n[Number of Frequencies] 3\n[Network Data]\n1 0.5 0 0.4 10 0.3 20 0.2 30\n2 0.5 0 0.4 10\n`);
    expect(r.value).toBeNull();
    expect(r.errors[0]).toMatchObject({ code: 'frequency-count', line: 0 });
    expect(r.errors[0].message).toBe(
      'the file ends at line 8, without [End], after 1 of the 3 points [Number of Frequencies] declares and 5 of the 9 values of the next: it looks cut short',
    );
  });

  it('a line of prose in the data is called text, not a bad number, and a point it cuts short is named', () => {
    const r = read('# GHz S MA R 50\n1 0.5 0 0.5 0 0.5 0 0.5 0\n2 0.5 0 0.5 0\nMeasured by the lab on Tuesday\n');
    expect(r.errors[0]).toMatchObject({ code: 'bad-number', line: 4, column: 1 });
    expect(r.errors[0].message).toBe(
      'this line is text, not data ("Measured by the lab on Tuesday"); a comment starts with "!"; the point that starts at line 3 has 5 of its 9 values, so the data end here cut short',
    );
  });

  it('a token that is no number inside a line is still named as one', () => {
    const r = read('# GHz S MA R 50\n1 0.5 0 0.5 x 0.5 0 0.5 0\n');
    expect(r.errors[0]).toMatchObject({ code: 'bad-number', line: 2, column: 13 });
    expect(r.errors[0].message).toContain('"x" is not a number');
  });

  it('a file with an option line and no data says where it ends', () => {
    const r = read('! exported by a script that failed\n# GHz S MA R 50\n\n');
    expect(r.errors[0]).toMatchObject({ code: 'no-data', line: 0 });
    expect(r.errors[0].message).toBe('the file holds no network data: it ends at line 3, and nothing after the option line (line 2) is data');
  });
});
