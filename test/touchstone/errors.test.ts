/**
 * Bad input: one positioned error with a code, never a partial result, never
 * an exception. Each case asserts the code, the line (and column where it
 * applies) and what the message tells the user.
 */
import { describe, expect, it } from 'vitest';
import { readTouchstone, formatDiagnostic } from '../../src/touchstone/index.js';

function bad(text: string | Uint8Array, fileName = 'part.s2p') {
  const r = readTouchstone(text, { fileName });
  expect(r.value).toBeNull();
  expect(r.errors).toHaveLength(1);
  return r.errors[0];
}

const v2 = (body: string) => `[Version] 2.0\n# GHz S RI R 50\n${body}`;

describe('errors name the line and what was expected', () => {
  it('too few values at the end of the file', () => {
    const e = bad('# GHz S RI\n1 0 0 0 0 0 0 0 0\n2 0 0 0 0 0 0 0\n');
    expect(e).toMatchObject({ code: 'value-count', line: 3 });
    expect(e.message).toContain('has 8 values');
    expect(e.message).toContain('a 2-port point holds 9 values (the frequency and 4 pairs in the order N11 N21 N12 N22)');
  });

  it('more values on a line than a point holds', () => {
    const e = bad('# GHz S RI\n1 0 0 0 0 0 0 0 0 5\n');
    expect(e).toMatchObject({ code: 'value-count', line: 2, column: 19 });
    expect(e.message).toContain('each point starts on a new line');
  });

  it('a non-numeric token, with its column', () => {
    const e = bad('# GHz S RI\n1 0 0 0.5x 0 0 0 0 0\n');
    expect(e).toMatchObject({ code: 'bad-number', line: 2, column: 7 });
    expect(e.message).toBe('"0.5x" is not a number; expected a value such as 0.5, -12.25 or 1.5e-3');
    expect(formatDiagnostic('part.s2p', e)).toBe('part.s2p:2:7: "0.5x" is not a number; expected a value such as 0.5, -12.25 or 1.5e-3');
  });

  it('frequency not increasing (a 4-port, where noise data cannot explain it)', () => {
    const pt = (f: number) => `${f} ${'0 0 '.repeat(4)}\n${'0 0 '.repeat(4)}\n${'0 0 '.repeat(4)}\n${'0 0 '.repeat(4)}\n`;
    const e = bad(`# GHz S RI\n${pt(2)}${pt(1)}`, 'x.s4p');
    expect(e).toMatchObject({ code: 'frequency-order', line: 6 });
    expect(e.message).toContain('below the previous one (2 GHz, line 2)');
  });

  it('a repeated frequency names both lines', () => {
    const e = bad('# MHz S RI\n100 0 0 0 0 0 0 0 0\n100 0 0 0 0 0 0 0 0\n');
    expect(e).toMatchObject({ code: 'duplicate-frequency', line: 3 });
    expect(e.message).toContain('at lines 2 and 3');
  });

  it('version 2 without [Number of Ports]', () => {
    const e = bad(v2('[Number of Frequencies] 1\n[Network Data]\n1 0 0\n'), 'a.ts');
    expect(e).toMatchObject({ code: 'missing-keyword', line: 4 });
    expect(e.message).toContain('must declare [Number of Ports]');
  });

  it('counts that contradict [Number of Frequencies], too few and too many', () => {
    const few = bad(v2('[Number of Ports] 1\n[Number of Frequencies] 3\n[Network Data]\n1 0 0\n2 0 0\n[End]\n'), 'a.ts');
    expect(few).toMatchObject({ code: 'frequency-count', line: 8 });
    expect(few.message).toContain('declares 3 points, but the network data hold 2');
    const many = bad(v2('[Number of Ports] 1\n[Number of Frequencies] 1\n[Network Data]\n1 0 0\n2 0 0\n'), 'a.ts');
    expect(many).toMatchObject({ code: 'frequency-count', line: 7 });
  });

  it('an unknown option, with its column and the list of what is allowed', () => {
    const e = bad('# GHz S XY R 50\n1 0 0 0 0 0 0 0 0\n');
    expect(e).toMatchObject({ code: 'unknown-option', line: 1, column: 9 });
    expect(e.message).toContain('expected a frequency unit (Hz, kHz, MHz, GHz), a parameter (S, Y, Z, H, G), a format (DB, MA, RI)');
    expect(bad('# GHz S MA R50\n1 0 0 0 0 0 0 0 0\n').message).toContain('write "R 50" with a space');
  });

  it('a negative magnitude in MA format', () => {
    const e = bad('# GHz S MA\n1 0.1 0 -0.9 10 0 0 0 0\n');
    expect(e).toMatchObject({ code: 'negative-magnitude', line: 2, column: 9 });
  });

  it('a complex reference impedance (not Touchstone)', () => {
    expect(bad('# GHz S RI R (50+50j)\n1 0 0 0 0 0 0 0 0\n')).toMatchObject({ code: 'option-value', line: 1, column: 14 });
  });

  it('an unknown keyword lists the valid ones', () => {
    const e = bad(v2('[Number of Ports] 1\n[Number of Freqs] 1\n'), 'a.ts');
    expect(e).toMatchObject({ code: 'unknown-keyword', line: 4 });
    expect(e.message).toContain('[Number of Frequencies]');
  });

  it('a keyword in a version 1 file', () => {
    expect(bad('# GHz S RI\n[Number of Ports] 2\n')).toMatchObject({ code: 'unknown-keyword', line: 2 });
  });

  it('H-parameters on a 3-port', () => {
    expect(bad('# GHz H RI\n1 ' + '0 0 '.repeat(9) + '\n', 'a.s3p')).toMatchObject({ code: 'parameter-ports', line: 1 });
  });

  it('an unsupported [Version]', () => {
    expect(bad('[Version] 3.0\n', 'a.ts')).toMatchObject({ code: 'version', line: 1 });
  });

  it('a .ts file that does not start with [Version]', () => {
    expect(bad('# GHz S RI\n1 0 0\n', 'a.ts')).toMatchObject({ code: 'port-count', line: 0 });
    expect(bad('# GHz S RI\n1 0 0\n', 'a.s1p.ts').code).toBe('port-count');
  });

  it('a version 1 file whose name gives no port count', () => {
    const e = bad('# GHz S RI\n1 0 0\n', 'measured.txt');
    expect(e).toMatchObject({ code: 'port-count', line: 0 });
    expect(e.message).toContain('.s2p for 2 ports');
  });

  it('binary data', () => {
    expect(bad(Uint8Array.of(35, 10, 49, 0, 50, 10))).toMatchObject({ code: 'not-text', line: 2 });
  });

  it('an empty file, and a file with only an option line', () => {
    expect(bad('')).toMatchObject({
      code: 'no-data',
      line: 0,
      message: 'the file is empty (0 bytes); expected a Touchstone file ("# GHz S MA R 50" followed by the data)',
    });
    expect(bad('! nothing here\n')).toMatchObject({ code: 'missing-option-line', line: 0 });
    expect(bad('! nothing here\n# GHz S RI\n')).toMatchObject({ code: 'no-data', line: 0 });
  });

  it('data before the option line', () => {
    expect(bad('1 0 0 0 0 0 0 0 0\n')).toMatchObject({ code: 'missing-option-line', line: 1 });
  });

  it('noise parameters that start above the last network frequency get a hint', () => {
    const e = bad('# GHz S MA\n1 0 0 0 0 0 0 0 0\n2 1.5 0.4 45 0.5\n');
    expect(e.code).toBe('value-count');
    expect(e.message).toContain('noise parameters, they must start at a frequency not above the last network frequency');
  });

  it('data after the network data in version 2 without [Noise Data]', () => {
    expect(bad(v2('[Number of Ports] 1\n[Number of Frequencies] 1\n[Network Data]\n1 0 0\n[Number of Ports] 2\n'), 'a.ts')).toMatchObject({
      code: 'keyword-order',
      line: 7,
    });
  });
});
