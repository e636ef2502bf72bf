/**
 * The Touchstone reader against the rules of the Touchstone File Format
 * Specification (IBIS Open Forum, version 1.1 and 2.0; 2.1 = 2.0 plus per-port
 * R on the option line). The small files here are written for these tests in
 * the manner of the specification's examples (from memory, not copied).
 */
import { describe, expect, it } from 'vitest';
import { readTouchstone, type TouchstoneData } from '../../src/touchstone/index.js';
import { expectComplexClose, sAt, polar } from '../helpers.js';

function ok(text: string, fileName = 'x.s2p'): TouchstoneData {
  const r = readTouchstone(text, { fileName });
  if (!r.value) throw new Error(`unexpected error: ${JSON.stringify(r.errors)}`);
  return r.value;
}

describe('version 1 layout', () => {
  it('2-port order is N11 N21 N12 N22 ("21 before 12"), MA, with comments, tabs and blank lines', () => {
    const d = ok(
      `! a comment\n\n# GHz S MA R 50\n! freq |S11| ∠S11 |S21| ∠S21 |S12| ∠S12 |S22| ∠S22\n1.0\t0.5 10  0.9 -20 0.01 30  0.4 40 ! trailing comment\n\n2.0 0.5 11 0.9 -21 0.01 31 0.4 41\n`,
    );
    const net = d.network;
    expect(net.ports).toBe(2);
    expect(Array.from(net.freqHz)).toEqual([1e9, 2e9]);
    expectComplexClose(sAt(net, 0, 2, 1), polar(0.9, -20), 1e-15, 'S21 is the second pair');
    expectComplexClose(sAt(net, 0, 1, 2), polar(0.01, 30), 1e-15, 'S12 is the third pair');
    expectComplexClose(sAt(net, 1, 2, 2), polar(0.4, 41), 1e-15, 'S22');
    expect(d.info.comments).toEqual(['a comment', 'freq |S11| ∠S11 |S21| ∠S21 |S12| ∠S12 |S22| ∠S22']);
  });

  it('option tokens in any order and case, each classified by what it is', () => {
    for (const line of ['# MHz RI', '# ri mhz', '# Ri S mHz', '# R 50 RI MHz S', '# mhz r 50 s ri']) {
      const d = ok(`${line}\n100 0.1 0.2 0.3 0.4 0.5 0.6 0.7 0.8\n`);
      expect(d.info.format).toBe('RI');
      expect(d.network.freqHz[0]).toBe(1e8);
      expectComplexClose(sAt(d.network, 0, 2, 1), [0.3, 0.4], 0, line);
    }
  });

  it('a bare "#" takes the defaults: GHz, S, MA, R 50', () => {
    const d = ok('#\n1 0.5 90 0 0 0 0 0 0\n');
    expect(d.info).toMatchObject({ frequencyUnit: 'GHz', parameter: 'S', format: 'MA' });
    expect(Array.from(d.network.z0)).toEqual([50, 50]);
    expectComplexClose(sAt(d.network, 0, 1, 1), [0, 0.5], 1e-16);
  });

  it('only the first option line counts; a later one is ignored with a warning', () => {
    const r = readTouchstone('# Hz S RI R 75\n# GHz S MA R 50\n1 0.1 0 0 0 0 0 0 0\n', { fileName: 'a.s2p' });
    expect(r.value?.network.freqHz[0]).toBe(1);
    expect(Array.from(r.value?.network.z0 ?? [])).toEqual([75, 75]);
    expect(r.warnings.map((w) => [w.code, w.line])).toEqual([['later-option-line', 2]]);
  });

  it('DB format: 20·log10|S| and degrees', () => {
    const d = ok('# GHz S DB\n1 -20 0 -0.5 -90 -40 0 -20 180\n');
    expectComplexClose(sAt(d.network, 0, 1, 1), [0.1, 0], 1e-16);
    expectComplexClose(sAt(d.network, 0, 2, 1), polar(Math.pow(10, -0.5 / 20), -90), 1e-16);
    expectComplexClose(sAt(d.network, 0, 2, 2), [-0.1, 0], 1e-16);
  });

  it('3- and 4-ports are row by row, a row per line', () => {
    const rows = [1, 2, 3, 4].map((i) => [1, 2, 3, 4].map((j) => `${i}.${j} 0`).join(' '));
    const d = ok(`# Hz S RI\n5 ${rows[0]}\n${rows.slice(1).join('\n')}\n`, 'four.s4p');
    expect(d.network.ports).toBe(4);
    for (let i = 1; i <= 4; i++) for (let j = 1; j <= 4; j++) expect(sAt(d.network, 0, i, j)[0]).toBe(Number(`${i}.${j}`));
  });

  it('5 and more ports wrap each row after 4 pairs; the reader counts values, not lines', () => {
    const n = 5;
    const row = (i: number) => Array.from({ length: n }, (_, j) => `${i + 1}${j + 1} -${j}`);
    const lines: string[] = [];
    for (let i = 0; i < n; i++) {
      const pairs = row(i);
      lines.push(`${i === 0 ? '7' : ' '} ${pairs.slice(0, 4).join(' ')}`, `  ${pairs.slice(4).join(' ')}`);
    }
    const d = ok(`# Hz S RI\n${lines.join('\n')}\n`, 'five.s5p');
    expect(sAt(d.network, 0, 5, 5)).toEqual([55, -4]);
    expect(sAt(d.network, 0, 3, 1)).toEqual([31, -0]);
  });

  it('the port count comes from the extension, in any case (.S3P)', () => {
    const d = ok('# Hz S RI\n1 1 0 2 0 3 0 4 0 5 0 6 0 7 0 8 0 9 0\n', 'THREE.S3P');
    expect(d.network.ports).toBe(3);
    expect(sAt(d.network, 0, 2, 1)[0]).toBe(4); // row-major from 3 ports
  });

  it('CRLF line endings and no final newline', () => {
    const d = ok('# GHz S RI\r\n1 0.1 0 0.2 0 0.3 0 0.4 0\r\n2 0.1 0 0.2 0 0.3 0 0.4 0');
    expect(d.network.freqHz.length).toBe(2);
  });
});

describe('Y, Z, H and G data are converted to S', () => {
  // Expected S from circuit theory at 50 Ω (Pozar ch. 4, from memory):
  // a load Z: S11 = (Z − 50)/(Z + 50); series Rs: S11 = Rs/(Rs + 100), S21 = 100/(Rs + 100);
  // shunt Rp: S11 = −50/(2Rp + 50), S21 = 2Rp/(2Rp + 50).
  it('version 1 Z is normalized to R: z = 2 is 100 Ω, S11 = 1/3', () => {
    const d = ok('# GHz Z RI R 50\n1 2 0\n', 'load.s1p');
    expectComplexClose(sAt(d.network, 0, 1, 1), [1 / 3, 0], 1e-15);
  });

  it('version 1 Y is normalized to R: y = Y·R = 0.5 is 0.01 S = 100 Ω, S11 = 1/3', () => {
    const d = ok('# GHz Y RI R 50\n1 0.5 0\n', 'load.s1p');
    expectComplexClose(sAt(d.network, 0, 1, 1), [1 / 3, 0], 1e-15);
  });

  it('version 1 R 75: z = 1 is a matched 75 Ω load (S11 = 0 at the 75 Ω reference)', () => {
    const d = ok('# GHz Z RI R 75\n1 1 0\n', 'load.s1p');
    expectComplexClose(sAt(d.network, 0, 1, 1), [0, 0], 1e-15);
    expect(d.network.z0[0]).toBe(75);
  });

  it('version 1 H of a series 50 Ω resistor: h11 = H11/R = 1, h12 = 1, h21 = −1, h22 = H22·R = 0', () => {
    // H11 = V1/I1 (V2 = 0) = Rs; H12 = V1/V2 (I1 = 0) = 1; H21 = I2/I1 (V2 = 0) = −1; H22 = I2/V2 (I1 = 0) = 0
    const d = ok('# GHz H RI R 50\n1 1 0 -1 0 1 0 0 0\n');
    expectComplexClose(sAt(d.network, 0, 1, 1), [1 / 3, 0], 1e-15, 'S11');
    expectComplexClose(sAt(d.network, 0, 2, 1), [2 / 3, 0], 1e-15, 'S21');
    expectComplexClose(sAt(d.network, 0, 1, 2), [2 / 3, 0], 1e-15, 'S12');
  });

  it('version 1 G of a shunt 50 Ω resistor: g11 = G11·R = 1, g12 = −1, g21 = 1, g22 = G22/R = 0', () => {
    const d = ok('# GHz G RI R 50\n1 1 0 1 0 -1 0 0 0\n');
    expectComplexClose(sAt(d.network, 0, 1, 1), [-1 / 3, 0], 1e-15, 'S11');
    expectComplexClose(sAt(d.network, 0, 2, 1), [2 / 3, 0], 1e-15, 'S21');
  });

  it('version 2 Z is in ohms and H11 in ohms', () => {
    const z = ok('[Version] 2.0\n# GHz Z RI R 50\n[Number of Ports] 1\n[Number of Frequencies] 1\n[Network Data]\n1 100 0\n[End]\n', 'a.ts');
    expectComplexClose(sAt(z.network, 0, 1, 1), [1 / 3, 0], 1e-15);
    const h = ok(
      '[Version] 2.0\n# GHz H RI R 50\n[Number of Ports] 2\n[Two-Port Data Order] 21_12\n[Number of Frequencies] 1\n[Network Data]\n1 50 0 -1 0 1 0 0 0\n',
      'b.ts',
    );
    expectComplexClose(sAt(h.network, 0, 1, 1), [1 / 3, 0], 1e-15);
    expectComplexClose(sAt(h.network, 0, 2, 1), [2 / 3, 0], 1e-15);
  });

  it('version 2 Y with per-port references: two 100 Ω loads seen from 50 Ω and 25 Ω', () => {
    // two uncoupled 100 Ω loads, Y = diag(0.01 S): each port sees (100 − R)/(100 + R)
    const d = ok(
      '[Version] 2.0\n# GHz Y RI\n[Number of Ports] 2\n[Two-Port Data Order] 12_21\n[Number of Frequencies] 1\n[Reference] 50\n 25\n[Network Data]\n1 0.01 0 0 0 0 0 0.01 0\n[End]\n',
      'c.ts',
    );
    expect(Array.from(d.network.z0)).toEqual([50, 25]);
    expectComplexClose(sAt(d.network, 0, 1, 1), [(100 - 50) / 150, 0], 1e-15, 'S11: 100 Ω load at 50 Ω');
    expectComplexClose(sAt(d.network, 0, 2, 2), [(100 - 25) / 125, 0], 1e-15, 'S22: 100 Ω load at 25 Ω');
  });
});

const v2 = (body: string, head = '# GHz S RI R 50') => `[Version] 2.0\n${head}\n${body}`;

describe('version 2 keywords', () => {
  it('[Two-Port Data Order] 12_21 reads N11 N12 N21 N22; keywords are case-insensitive', () => {
    const d = ok(v2('[number of PORTS] 2\n[two-port data order] 12_21\n[Number of Frequencies] 1\n[network data]\n1 1 0 2 0 3 0 4 0\n[end]\n'), 'a.ts');
    expect(sAt(d.network, 0, 1, 2)[0]).toBe(2);
    expect(sAt(d.network, 0, 2, 1)[0]).toBe(3);
    expect(d.info.version).toBe('2.0');
  });

  it('[Reference] may continue on the next line and carry comments; it overrides R', () => {
    const d = ok(
      v2(
        '[Number of Ports] 3\n[Number of Frequencies] 1\n[Reference] 50 ! first\n  75 ! second line\n 100\n[Network Data]\n1 ' + '0 0 '.repeat(9) + '\n',
        '# GHz S RI R 20',
      ),
      'r.ts',
    );
    expect(Array.from(d.network.z0)).toEqual([50, 75, 100]);
  });

  it('[Matrix Format] Lower and Upper mirror the missing half', () => {
    const lower = ok(v2('[Number of Ports] 3\n[Number of Frequencies] 1\n[Matrix Format] Lower\n[Network Data]\n1 11 0\n21 0 22 0\n31 0 32 0 33 0\n'), 'l.ts');
    const upper = ok(v2('[Number of Ports] 3\n[Number of Frequencies] 1\n[Matrix Format] upper\n[Network Data]\n1 11 0 12 0 13 0\n22 0 23 0\n33 0\n'), 'u.ts');
    expect(sAt(lower.network, 0, 1, 3)[0]).toBe(31);
    expect(sAt(lower.network, 0, 3, 1)[0]).toBe(31);
    expect(sAt(upper.network, 0, 3, 2)[0]).toBe(23);
    expect(sAt(upper.network, 0, 2, 2)[0]).toBe(22);
  });

  it('[Mixed-Mode Order] is kept, and sets differential 2R and common R/2 references', () => {
    const d = ok(
      v2('[Number of Ports] 4\n[Number of Frequencies] 1\n[Mixed-Mode Order] D1,2 D3,4 C1,2 C3,4\n[Network Data]\n1 ' + '0 0 '.repeat(16) + '\n'),
      'm.ts',
    );
    expect(d.info.mixedModeOrder).toEqual(['D1,2', 'D3,4', 'C1,2', 'C3,4']);
    expect(Array.from(d.network.z0)).toEqual([100, 100, 25, 25]);
  });

  it('[Begin Information] … [End Information] is skipped and kept', () => {
    const d = ok(
      v2('[Number of Ports] 1\n[Begin Information]\n[Manufacturer] Nowhere Labs\n[End Information]\n[Number of Frequencies] 1\n[Network Data]\n1 0.1 0\n'),
      'i.ts',
    );
    expect(d.info.information).toEqual(['[Manufacturer] Nowhere Labs']);
  });

  it('[Noise Data] with Rn in ohms; version 1 noise with Rn normalized to R', () => {
    const d = ok(
      v2(
        '[Number of Ports] 2\n[Two-Port Data Order] 12_21\n[Number of Frequencies] 1\n[Number of Noise Frequencies] 2\n[Network Data]\n2 0 0 0 0 3 0 0 0\n[Noise Data]\n1 0.5 0.3 90 10\n3 0.7 0.2 -90 12\n[End]\n',
      ),
      'n.ts',
    );
    expect(Array.from(d.noise?.rnOhms ?? [])).toEqual([10, 12]);
    expect(Array.from(d.noise?.freqHz ?? [])).toEqual([1e9, 3e9]);
    expectComplexClose([d.noise!.gammaOpt[0], d.noise!.gammaOpt[1]], [0, 0.3], 1e-16);
    // v1: the noise block starts at the first frequency not above the last network frequency — here equal to it
    const v1 = ok('# GHz S MA R 50\n1 0 0 3 0 0 0 0 0\n2 0 0 3 0 0 0 0 0\n2 1.5 0.4 45 0.5\n4 1.8 0.3 60 0.6\n');
    expect(v1.network.freqHz.length).toBe(2);
    expect(Array.from(v1.noise!.freqHz)).toEqual([2e9, 4e9]);
    expect(Array.from(v1.noise!.rnOhms)).toEqual([25, 30]);
    expect(Array.from(v1.noise!.nfMinDb)).toEqual([1.5, 1.8]);
  });

  it('2.1: per-port R values on the option line', () => {
    const d = ok(
      '[Version] 2.1\n# GHz S RI R 50 75\n[Number of Ports] 2\n[Two-Port Data Order] 12_21\n[Number of Frequencies] 1\n[Network Data]\n1 0 0 0 0 0 0 0 0\n[End]\n',
      'p.ts',
    );
    expect(d.info.version).toBe('2.1');
    expect(Array.from(d.network.z0)).toEqual([50, 75]);
  });

  it('reads the same bytes fed one at a time as at once', async () => {
    const { TouchstoneParser, parseTouchstone } = await import('../../src/touchstone/parse.js');
    const text = new TextEncoder().encode(
      v2(
        '[Number of Ports] 2\n[Two-Port Data Order] 21_12\n[Number of Frequencies] 3\n[Network Data]\n1 1 2 3 4 5 6 7 8\n2 1 2 3 4 5 6 7 8\n3 1 2 3 4 5 6 7 8\n',
      ),
    );
    const p = new TouchstoneParser({ fileName: 'x.ts' });
    for (let i = 0; i < text.length; i++) p.push(text.subarray(i, i + 1));
    const one = p.finish();
    const all = parseTouchstone(text, { fileName: 'x.ts' });
    expect(one.errors).toEqual([]);
    expect(Array.from(one.record!.values)).toEqual(Array.from(all.record!.values));
    expect(Array.from(one.record!.freqHz)).toEqual([1e9, 2e9, 3e9]);
  });
});

describe('frequencies are exact in every unit', () => {
  it('1.1 GHz is 1.1e9 exactly, 2.45 GHz is 2.45e9, 100.5 kHz is 100500', () => {
    const d = ok('# GHz S RI\n1.1 0 0 0 0 0 0 0 0\n2.45 0 0 0 0 0 0 0 0\n');
    expect(Array.from(d.network.freqHz)).toEqual([1.1e9, 2.45e9]);
    expect(ok('# kHz S RI\n100.5 0 0 0 0 0 0 0 0\n').network.freqHz[0]).toBe(100500);
    expect(ok('# MHz S RI\n1.23456789012345678 0 0 0 0 0 0 0 0\n').network.freqHz[0]).toBe(1234567.89012345678);
  });
  it('numbers in every accepted spelling', () => {
    const d = ok('# Hz S RI\n1 +.5 -0.25 1e-3 1E+2 5. -0 .125e1 7\n');
    // storage is row-major (S11 S12 S21 S22); the file gives S11 S21 S12 S22
    expect(Array.from(d.network.s)).toEqual([0.5, -0.25, 5, -0, 1e-3, 100, 1.25, 7]);
  });
});
