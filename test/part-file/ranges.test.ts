/**
 * Values that make no sense are errors at their own line: numbers beyond the
 * double range, levels and apertures out of their documented ranges, dates
 * that are not calendar dates, negative band edges, malformed quantities;
 * and the bytes of a part file: NUL, Latin-1, UTF-16, size. YAML aliases are
 * read (YAML 1.2 §3.2.2.2 makes them part of the language), with a bound on
 * how far they expand.
 */
import { describe, expect, it } from 'vitest';
import { loadPartText } from '../../src/part-file/load.js';
import { parseQuantity } from '../../src/part-file/quantity.js';
import { decodeYamlSource, MAX_YAML_BYTES } from '../../src/part-file/source.js';
import { isCalendarDate } from '../../src/part-file/validate.js';

const good = `part: XQ-1
class: filter
date: 2026-11-20
measurements:
  - {unit: SN1, file: data/sn1.s2p}
bands:
  passband: {from: 2.40 GHz, to: 2.50 GHz}
limits:
  - {figure: insertion-loss, on: S21, band: passband, max: 1.2 dB}
  - {figure: bandwidth, on: S21, band: passband, min: 80 MHz, level: 3 dB}
  - {figure: group-delay, on: S21, band: passband, max: 4.78 ns, aperture: 2}
`;

const errorsOf = (text: string) => {
  const r = loadPartText(text, 'part.yaml');
  expect(r.value).toBeNull();
  return r.errors;
};

describe('numbers in their documented ranges', () => {
  it('the good file loads', () => {
    expect(loadPartText(good, 'part.yaml').errors).toEqual([]);
  });

  it('a bandwidth level must be above 0 and at most 60 dB: level -3 dB is an error at its line', () => {
    const [e] = errorsOf(good.replace('level: 3 dB', 'level: -3 dB'));
    expect(e).toMatchObject({ code: 'bad-value', line: 10 });
    expect(e.message).toContain('level -3 dB is out of range');
    expect(errorsOf(good.replace('level: 3 dB', 'level: 0 dB'))[0].line).toBe(10);
    expect(errorsOf(good.replace('level: 3 dB', 'level: 61 dB'))[0].line).toBe(10);
  });

  it('a group-delay aperture is a whole number from 1 to 100: aperture 1e9 is an error at its column', () => {
    const [e] = errorsOf(good.replace('aperture: 2', 'aperture: 1e9'));
    expect(e).toMatchObject({ code: 'bad-value', line: 11, column: 76 });
    expect(e.message).toBe('aperture must be a whole number from 1 to 100, got 1000000000');
  });

  it('a number beyond the double range (1e400) is an error, never Infinity published as null', () => {
    const [e] = errorsOf(good.replace('max: 1.2 dB', 'max: 1e400 dB'));
    expect(e).toMatchObject({ line: 9 });
    expect(e.message).toContain('beyond the range of numbers');
    expect(parseQuantity('-1e400 dB').ok).toBe(false);
    expect(parseQuantity(1e400).ok).toBe(false);
  });

  it('the sign of a quantity is +, - or − (U+2212), not any character between them', () => {
    // the old pattern [+-−] was a range from U+002B to U+2212, letters and ~ included
    for (const bad of ['l5 dB', '~2.5 dB', 'a1 dB', 'z1 GHz']) expect(parseQuantity(bad).ok, bad).toBe(false);
    expect(parseQuantity('−2.5 dB')).toMatchObject({ ok: true, value: -2.5 });
    expect(errorsOf(good.replace('max: 1.2 dB', 'max: l5 dB'))[0]).toMatchObject({ line: 9, column: 60 });
  });

  it('a band edge below 0 Hz is an error at its line', () => {
    const [e] = errorsOf(good.replace('from: 2.40 GHz', 'from: -2.40 GHz'));
    expect(e).toMatchObject({ code: 'bad-value', line: 7 });
    expect(e.message).toContain('negative frequency');
  });
});

describe('dates are days of the calendar', () => {
  it('2026-13-45 and 2026-02-30 are errors at their line; 2028-02-29 (a leap year) is a date', () => {
    for (const bad of ['2026-13-45', '2026-02-30', '2026-04-31', '2027-02-29', '2026-00-10']) {
      const [e] = errorsOf(good.replace('date: 2026-11-20', `date: ${bad}`));
      expect(e, bad).toMatchObject({ code: 'bad-value', line: 3, column: 7 });
      expect(e.message).toContain('is not a date of the calendar');
    }
    expect(isCalendarDate('2028-02-29')).toBe(true);
    expect(isCalendarDate('2000-02-29')).toBe(true); // divisible by 400 (Gregorian rule, common practice)
    expect(isCalendarDate('1900-02-29')).toBe(false); // divisible by 100 but not 400
  });
});

describe('YAML aliases', () => {
  it('are read like the nodes they name (YAML 1.2 anchors and aliases)', () => {
    const text = good.replace(
      '  - {unit: SN1, file: data/sn1.s2p}',
      '  - {unit: SN1, file: data/sn1.s2p, conditions: &room {temperature: 25 °C}}\n  - {unit: SN2, file: data/sn2.s2p, conditions: *room}',
    );
    const r = loadPartText(text, 'part.yaml');
    expect(r.errors).toEqual([]);
    expect(r.value?.measurements.map((m) => m.conditions)).toEqual([{ temperature: '25 °C' }, { temperature: '25 °C' }]);
  });

  it('a nested expansion bomb (10^9 nodes if expanded) ends quickly in errors, and past 1,000 alias uses in one error', () => {
    const levels = ['a: &a [x, x, x, x, x, x, x, x, x, x]'];
    for (let i = 1; i < 9; i++)
      levels.push(
        `${String.fromCharCode(97 + i)}: &${String.fromCharCode(97 + i)} [${Array(10)
          .fill(`*${String.fromCharCode(96 + i)}`)
          .join(', ')}]`,
      );
    const bomb = `part: X\nclass: filter\nmeasurements:\n  - {unit: A, file: a.s2p}\nmixed-mode: {pairs: [${levels.map((l) => `{${l}}`).join(', ')}, *i]}\n`;
    const t0 = performance.now();
    expect(loadPartText(bomb, 'part.yaml').errors.length).toBeGreaterThan(0);
    expect(performance.now() - t0).toBeLessThan(5000); // a generous bound for a slow machine; the walk follows the schema's depth, not the alias graph's
    const many = `part: X\nclass: filter\nmeasurements:\n  - {unit: A, file: a.s2p}\nrevision: &r B\ncautions: [${Array(1200).fill('*r').join(', ')}]\n`;
    const errors = loadPartText(many, 'part.yaml').errors;
    expect(errors.filter((e) => e.message.includes('alias uses'))).toHaveLength(1);
    expect(errors[0].message).toBe('more than 1000 alias uses (*name); a part file needs few, and this many is how a file expands without bound');
  });
});

describe('the bytes of a part file', () => {
  const enc = (s: string) => new TextEncoder().encode(s);

  it('a NUL byte is an error at its line and column', () => {
    const r = decodeYamlSource(enc('part: X\nclass: fil\0ter\n'), 'part.yaml');
    expect(r).toMatchObject({ ok: false, error: { code: 'bad-encoding', line: 2, column: 11 } });
  });

  it('Latin-1 bytes (é as 0xE9) are an error naming the byte, at its line and column', () => {
    const bytes = Uint8Array.from([...enc('part: X\ntitle: Filtre passe-bande, fr'), 0xe9, ...enc('quence\n')]);
    const r = decodeYamlSource(bytes, 'part.yaml');
    expect(r.ok).toBe(false);
    if (!r.ok) {
      expect(r.error).toMatchObject({ line: 2, column: 30 });
      expect(r.error.message).toContain('byte 0xe9 is not UTF-8');
    }
  });

  it('UTF-8 with multi-byte characters and a byte-order mark is read; UTF-16 is named', () => {
    const r = decodeYamlSource(Uint8Array.from([0xef, 0xbb, 0xbf, ...enc('title: −55 to +125 °C, 2.40–2.50 GHz, µs\n')]), 'part.yaml');
    expect(r).toEqual({ ok: true, text: 'title: −55 to +125 °C, 2.40–2.50 GHz, µs\n' });
    const u16 = decodeYamlSource(Uint8Array.from([0xff, 0xfe, 0x70, 0, 0x61, 0]), 'part.yaml');
    expect(u16.ok || u16.error.message).toContain('UTF-16');
  });

  it('a file above 1 MiB is refused before it is parsed', () => {
    const r = decodeYamlSource(new Uint8Array(MAX_YAML_BYTES + 1).fill(0x20), 'part.yaml');
    expect(r.ok || r.error.message).toContain('refused unread');
  });
});
