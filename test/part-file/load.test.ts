/**
 * Part files: YAML 1.2, the schema, and every mistake reported at once with
 * its line, column and what was expected.
 */
import { parse as parseYaml } from 'yaml';
import { describe, expect, it } from 'vitest';
import { loadPartText } from '../../src/part-file/load.js';

const good = `part: XQ-1
class: filter
revision: B
measurements:
  - {unit: SN1, file: data/sn1.s2p, conditions: {temperature: 25 °C}}
bands:
  passband: {from: 2.40 GHz, to: 2.50 GHz}
limits:
  - {figure: insertion-loss, on: S21, band: passband, max: 1.2 dB}
  - {figure: group-delay, on: S21, band: passband, max: 4.78 ns}
`;

const errorsOf = (text: string) => {
  const r = loadPartText(text, 'part.yaml');
  expect(r.value).toBeNull();
  return r.errors;
};

describe('reading part files', () => {
  it('reads YAML 1.2, where the key "on" stays a key (YAML 1.1 makes it the boolean true)', () => {
    const r = loadPartText(good, 'part.yaml');
    expect(r.errors).toEqual([]);
    expect(r.value?.checks[0].on).toEqual(['S21']);
    // the pitfall this avoids, shown with the same library in YAML 1.1 mode:
    const yaml11 = parseYaml('limits:\n  - {on: S21}\n', { version: '1.1' }) as { limits: Array<Record<string, unknown>> };
    expect(Object.keys(yaml11.limits[0])).toEqual(['true']);
  });

  it('converts quantities to base units: 2.40 GHz → 2.4e9 Hz, 4.78 ns → 4.78e-9 s', () => {
    const p = loadPartText(good, 'part.yaml').value!;
    expect(p.bands.get('passband')).toMatchObject({ fromHz: 2.4e9, toHz: 2.5e9 });
    expect(p.checks[1].limit).toEqual({ max: 4.78e-9 });
    expect(p.measurements[0].conditions).toEqual({ temperature: '25 °C' });
  });

  it('an unknown key, with the nearest valid key suggested', () => {
    const [e] = errorsOf(good.replace('limits:', 'limts:'));
    expect(e).toMatchObject({ code: 'unknown-key', line: 8, column: 1 });
    expect(e.message).toBe('unknown key "limts" in the part file; did you mean "limits"?');
  });

  it('an unknown key inside a limit', () => {
    const errors = errorsOf(good.replace('band: passband, max: 1.2 dB', 'band: passband, maximum: 1.2 dB'));
    expect(errors.map((e) => [e.code, e.line, e.column])).toEqual([
      ['bad-limit', 9, 5], // the limit as a whole now has no max, min or tolerance
      ['unknown-key', 9, 55],
    ]);
    expect(errors[1].message).toContain('did you mean "max"?');
  });

  it('an unknown figure', () => {
    const [e] = errorsOf(good.replace('figure: insertion-loss', 'figure: insertion-los'));
    expect(e).toMatchObject({ code: 'unknown-figure', line: 9, column: 14 });
    expect(e.message).toContain('did you mean "insertion-loss"?');
  });

  it('an unknown class', () => {
    const [e] = errorsOf(good.replace('class: filter', 'class: filtre'));
    expect(e).toMatchObject({ code: 'unknown-class', line: 2, column: 8 });
    expect(e.message).toContain('did you mean "filter"?');
  });

  it('a frequency without its unit', () => {
    const [e] = errorsOf(good.replace('from: 2.40 GHz', 'from: 2.40'));
    expect(e).toMatchObject({ code: 'bare-frequency', line: 7, column: 20 });
    expect(e.message).toContain('a frequency always carries one');
  });

  it('dB given for a frequency', () => {
    const [e] = errorsOf(good.replace('to: 2.50 GHz', 'to: 2.50 dB'));
    expect(e).toMatchObject({ code: 'unit-mismatch', line: 7 });
    expect(e.message).toContain('is a level in dB; expected a frequency (Hz, kHz, MHz, GHz)');
  });

  it('a frequency given for a dB limit, and a dB limit without its unit', () => {
    const [a] = errorsOf(good.replace('max: 1.2 dB', 'max: 1.2 GHz'));
    expect(a).toMatchObject({ code: 'unit-mismatch', line: 9 });
    expect(a.message).toContain('insertion-loss is a level in dB');
    const [b] = errorsOf(good.replace('max: 1.2 dB', 'max: 1.2'));
    expect(b).toMatchObject({ code: 'missing-unit', line: 9 });
    expect(b.message).toContain('write 1.2 dB');
  });

  it('a band that does not exist', () => {
    const [e] = errorsOf(good.replace('on: S21, band: passband, max: 1.2', 'on: S21, band: passbnd, max: 1.2'));
    expect(e).toMatchObject({ code: 'unknown-band', line: 9 });
    expect(e.message).toContain('did you mean "passband"?');
  });

  it('a malformed S-parameter name', () => {
    const [e] = errorsOf(good.replace('on: S21, band: passband, max: 1.2', 'on: S123, band: passband, max: 1.2'));
    expect(e).toMatchObject({ code: 'bad-parameter', line: 9 });
    expect(e.message).toContain('put a comma between the two port numbers');
  });

  it('a tolerance with no default nominal', () => {
    const [e] = errorsOf(good.replace('max: 1.2 dB', 'tolerance: 0.2 dB'));
    expect(e).toMatchObject({ code: 'bad-limit', line: 9 });
    expect(e.message).toContain('insertion-loss has no default nominal');
  });

  it('a condition no unit has', () => {
    const [e] = errorsOf(good.replace('max: 1.2 dB}', 'max: 1.2 dB, when: {temperature: 85 °C}}'));
    expect(e).toMatchObject({ code: 'unknown-condition', line: 9 });
    expect(e.message).toContain('the units have temperature 25 °C');
  });

  it('YAML syntax errors and duplicate keys', () => {
    expect(errorsOf('part: [unclosed\n')[0].code).toBe('yaml-syntax');
    expect(errorsOf('part: A\npart: B\nclass: filter\n')[0]).toMatchObject({ code: 'yaml-syntax', line: 2 });
  });

  it('reports all the errors of a file at once, in line order', () => {
    const text = good
      .replace('class: filter', 'class: filtre')
      .replace('from: 2.40 GHz', 'from: 2.40')
      .replace('figure: insertion-loss', 'figure: insertion-los')
      .replace('revision: B', 'revison: B');
    const errors = errorsOf(text);
    expect(errors.map((e) => [e.code, e.line])).toEqual([
      ['unknown-class', 2],
      ['unknown-key', 3],
      ['bare-frequency', 7],
      ['unknown-figure', 9],
    ]);
    // (the band whose edge was bad is left out, but its limits do not add errors of their own)
  });

  it('missing required keys', () => {
    const errors = errorsOf('title: nothing else\n');
    expect(errors.map((e) => e.message)).toEqual(['the part file needs "part" (the part number)', 'the part file needs "class" (the component class)']);
  });
});

describe('custom figures under a quoted key', () => {
  it('"custom-figures": is read like the plain key (the compiler is asked for, not a pattern on the text)', () => {
    const text = `part: C-1\nclass: generic\nmeasurements:\n  - {unit: A, file: a.s4p}\n"custom-figures":\n  balance: {expression: "db(S31) - db(S41)", unit: dB, worse: higher}\nbands:\n  b: {from: 1 GHz, to: 2 GHz}\nlimits:\n  - {figure: balance, band: b, max: 1 dB}\n`;
    const first = loadPartText(text, 'part.yaml');
    expect(first.needsCompiler).toBe(true);
    const second = loadPartText(text, 'part.yaml', () => ({ ok: false, message: 'no such function here' }));
    expect(second.errors[0]).toMatchObject({ code: 'bad-expression', line: 6 });
  });
});
