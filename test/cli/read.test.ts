/**
 * The `scatterbook read` contract, through the real binary: stdout, stderr and
 * exit status (0 done, 1 bad input, 2 bad usage).
 */
import { spawnSync } from 'node:child_process';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';

const BIN = join(import.meta.dirname, '../../bin/scatterbook.js');
let dir: string;

function run(...args: string[]) {
  const r = spawnSync(process.execPath, [BIN, ...args], { cwd: dir, encoding: 'utf8', env: { ...process.env, NO_COLOR: undefined } });
  return { status: r.status, stdout: r.stdout, stderr: r.stderr };
}

beforeAll(() => {
  dir = mkdtempSync(join(tmpdir(), 'scatterbook-cli-'));
  writeFileSync(
    join(dir, 'amp.s2p'),
    '! test amplifier\n# GHz S RI R 50\n1 0.1 -0.02 0.9 0.1 0.05 0.01 0.2 0\n1.1 0.1 -0.02 3.0 0.1 0.05 0.01 0.2 0\n1.2 0.1 -0.02 1.2 2 0.2 0 0.1 0 3 1 ! too many\n',
  );
  writeFileSync(join(dir, 'pad.s2p'), '# GHz S RI R 50\n1 0.1 -0.02 0.9 0.1 0.9 0.1 0.05 0.01\n1.1 0.1 -0.02 0.9 0.1 0.9 0.1 0.05 0.01\n');
  writeFileSync(
    join(dir, 'noisy.ts'),
    '[Version] 2.0\n# GHz S MA R 50\n[Number of Ports] 2\n[Two-Port Data Order] 12_21\n[Number of Frequencies] 1\n[Number of Noise Frequencies] 1\n[Network Data]\n1 0.1 0 0.01 0 3 90 0.2 0\n[Noise Data]\n1 0.8 0.5 90 12.5\n[End]\n',
  );
}, 30_000);

describe('scatterbook read', () => {
  it('--json prints exactly the documented shape', () => {
    const r = run('read', 'pad.s2p', '--json');
    expect(r.status).toBe(0);
    expect(r.stderr).toBe('');
    expect(JSON.parse(r.stdout)).toEqual({
      ports: 2,
      version: '1.1',
      parameter: 'S',
      mixedModeOrder: null,
      frequencyHz: [1e9, 1.1e9],
      referenceOhms: [50, 50],
      s: [
        [
          [
            [0.1, -0.02],
            [0.9, 0.1],
          ],
          [
            [0.9, 0.1],
            [0.05, 0.01],
          ],
        ],
        [
          [
            [0.1, -0.02],
            [0.9, 0.1],
          ],
          [
            [0.9, 0.1],
            [0.05, 0.01],
          ],
        ],
      ],
      noise: null,
    });
  });

  it('a file in mixed-mode order says so: mixedModeOrder in --json names the rows, and the summary labels the references by mode (Touchstone 2.0 [Mixed-Mode Order])', () => {
    writeFileSync(
      join(dir, 'modes.ts'),
      '[Version] 2.0\n# GHz S RI R 50\n[Number of Ports] 4\n[Number of Frequencies] 1\n[Reference] 50 50 75 75\n[Mixed-Mode Order] D1,2 D3,4 C1,2 C3,4\n[Network Data]\n1 ' +
        '0 0 '.repeat(16) +
        '\n[End]\n',
    );
    const j = JSON.parse(run('read', 'modes.ts', '--json').stdout);
    expect(j.mixedModeOrder).toEqual(['D1,2', 'D3,4', 'C1,2', 'C3,4']);
    // differential 2R, common R/2 of the pair's single-ended references
    expect(j.referenceOhms).toEqual([100, 150, 25, 37.5]);
    const text = run('read', 'modes.ts').stdout;
    expect(text).toContain('ports        4, in mixed-mode order: the rows are the modes D1,2 D3,4 C1,2 C3,4');
    expect(text).toContain('reference    mode D1,2: 100 Ω, mode D3,4: 150 Ω, mode C1,2: 25 Ω, mode C3,4: 37.5 Ω');
    expect(text).not.toContain('port 1:');
  });

  it('--json copies numbers of an RI S-parameter file as written where they are JSON numbers, and formats the rest: the same values either way', () => {
    // +0.5, .5, 5., -0, 1E-3 and 0.25 written every way Touchstone allows; the MA copy of the same values is formatted throughout
    writeFileSync(join(dir, 'forms.s2p'), '# GHz S RI R 50\n1 +0.5 .5 5. -0 1E-3 0.25 -0.0 2.50e-1\n2 0 -1.5 1e0 00.5 0.125 -2E+0 3 -.75\n');
    const r = run('read', 'forms.s2p', '--json');
    expect(r.stderr).toBe('');
    const s = JSON.parse(r.stdout).s as number[][][][];
    // v1 2-port order N11 N21 N12 N22: row i, column j
    expect(s[0]).toEqual([
      [
        [0.5, 0.5],
        [0.001, 0.25],
      ],
      [
        [5, 0],
        [0, 0.25],
      ],
    ]);
    expect(s[1]).toEqual([
      [
        [0, -1.5],
        [0.125, -2],
      ],
      [
        [1, 0.5],
        [3, -0.75],
      ],
    ]);
    expect(r.stdout).toContain('[1E-3,0.25]'); // copied as written
    expect(Object.is(s[0][1][0][1], 0)).toBe(true); // −0 is written as 0, as JSON.stringify does
  });

  it('noise in the JSON: frequencyHz, nfMinDb, gammaOpt as [re, im], rnOhms', () => {
    const j = JSON.parse(run('read', 'noisy.ts', '--json').stdout);
    expect(j.version).toBe('2.0');
    expect(j.noise.frequencyHz).toEqual([1e9]);
    expect(j.noise.nfMinDb).toEqual([0.8]);
    expect(j.noise.gammaOpt[0][0]).toBeCloseTo(0, 15);
    expect(j.noise.gammaOpt[0][1]).toBeCloseTo(0.5, 15);
    expect(j.noise.rnOhms).toEqual([12.5]);
    // S is row = receiving port: S21 = 3∠90° sits at s[k][1][0]
    expect(j.s[0][1][0][1]).toBeCloseTo(3, 15);
  });

  it('a human summary names ports, points, references, passivity and reciprocity', () => {
    const r = run('read', 'pad.s2p');
    expect(r.status).toBe(0);
    expect(r.stdout).toContain('ports        2');
    expect(r.stdout).toContain('2, 1 GHz to 1.1 GHz');
    expect(r.stdout).toContain('50 Ω on every port');
    expect(r.stdout).toMatch(/passivity +largest singular value .*: passive/);
    expect(r.stdout).toMatch(/reciprocity +largest \|Sij − Sji\| 0 .*: reciprocal/);
    expect(r.stdout).not.toContain('\x1b['); // no colour when stdout is not a TTY
  });

  it('bad input: exit 1, FILE:LINE on stderr, nothing on stdout', () => {
    const r = run('read', 'amp.s2p', '--json');
    expect(r.status).toBe(1);
    expect(r.stdout).toBe('');
    expect(r.stderr).toMatch(/^amp\.s2p:5:\d+: error: more values on this line than one point holds/);
    expect(r.stderr).not.toMatch(/at .*\.js:\d+/); // no stack trace
  });

  it('a missing file is bad input, not a crash', () => {
    const r = run('read', 'nope.s2p');
    expect(r.status).toBe(1);
    expect(r.stderr).toBe('nope.s2p: error: cannot read the file: no such file\n');
  });

  it('bad usage exits 2 and suggests the nearest option or command', () => {
    const a = run('read', 'pad.s2p', '--jsn');
    expect(a.status).toBe(2);
    expect(a.stderr).toContain('unknown option --jsn; did you mean --json?');
    const b = run('raed', 'pad.s2p');
    expect(b.status).toBe(2);
    expect(b.stderr).toContain('did you mean "read"?');
    expect(run('read').status).toBe(2);
    expect(run().status).toBe(2);
  });

  it('--ports reads a version 1 file without an .sNp name', () => {
    writeFileSync(join(dir, 'export.txt'), '# GHz S RI\n1 0.5 0\n');
    expect(run('read', 'export.txt').status).toBe(1);
    expect(JSON.parse(run('read', 'export.txt', '--ports', '1', '--json').stdout).ports).toBe(1);
  });
});
