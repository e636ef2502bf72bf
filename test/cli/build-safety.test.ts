/**
 * `scatterbook build` must never delete what it did not make: every output
 * folder that is not absent, empty or a site it built is refused with exit 1
 * and one message, and every file is still there byte for byte afterwards.
 * Also: the parts that used to crash or hang the build (one unit, dense
 * sweeps, a part file that is a folder), folders that dead builds left
 * behind, and a mount point as the output folder.
 */
import { spawnSync } from 'node:child_process';
import { cpSync, existsSync, lstatSync, mkdirSync, mkdtempSync, readdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import { makeNetwork } from '../../src/network/network.js';
import { writeTouchstone } from '../../src/touchstone/write.js';
import { snapshot } from '../support/snapshot.js';

const ROOT = join(import.meta.dirname, '../..');
const BIN = join(ROOT, 'bin/scatterbook.js');
let dir: string;

function run(args: string[], cwd = dir, env: Record<string, string> = {}) {
  const r = spawnSync(process.execPath, [BIN, ...args], { cwd, encoding: 'utf8', timeout: 120_000, env: { ...process.env, ...env } });
  return { status: r.status, stdout: r.stdout, stderr: r.stderr, signal: r.signal };
}

/** A project folder: a content folder with one demo part, and a file of the user's own. */
function project(name: string): string {
  const p = join(dir, name);
  mkdirSync(join(p, 'content/parts'), { recursive: true });
  cpSync(join(ROOT, 'content/parts/vt-pad-10'), join(p, 'content/parts/vt-pad-10'), { recursive: true });
  writeFileSync(join(p, 'notes.txt'), "the user's own notes\n");
  return p;
}

beforeAll(() => {
  dir = mkdtempSync(join(tmpdir(), 'scatterbook-safety-'));
});

describe('the output folder: never delete what scatterbook did not make', () => {
  const refused: Array<[string, string, RegExp]> = [
    ['the working folder (--out .)', '.', /--out \.: holds the content folder/],
    ['the content folder', 'content', /--out content: is the content folder/],
    ['inside the content folder', 'content/parts', /--out content\/parts: lies inside the content folder/],
    ['a part folder inside the content folder', 'content/parts/vt-pad-10', /lies inside the content folder/],
    ['above the working folder', '..', /holds the content folder|holds the working folder/],
    ['the root of the file system', '/', /is the root of the file system/],
  ];
  for (const [what, out, message] of refused) {
    it(`refuses ${what}: exit 1, one message, every file still there byte for byte`, () => {
      const p = project(`p-${out.replace(/[^a-z]/gi, '_')}`);
      const before = snapshot(p);
      const r = run(['build', 'content', '--out', out, '--no-pdf', '--no-cache'], p);
      expect(r.status).toBe(1);
      expect(r.stderr).toMatch(message);
      expect(r.stderr.trim().split('\n')).toHaveLength(1);
      expect(r.stdout).toBe('');
      expect(snapshot(p)).toEqual(before);
    });
  }

  it('refuses the home folder and the folders above it', () => {
    const p = project('p-home');
    const home = join(p, 'home/user');
    mkdirSync(home, { recursive: true });
    writeFileSync(join(home, 'thesis.txt'), 'years of work\n');
    const before = snapshot(p);
    const r = run(['build', 'content', '--out', 'home/user', '--no-pdf', '--no-cache'], p, { HOME: home });
    expect(r.status).toBe(1);
    expect(r.stderr).toMatch(/is the home folder/);
    expect(run(['build', 'content', '--out', 'home', '--no-pdf', '--no-cache'], p, { HOME: home }).stderr).toMatch(/holds the home folder/);
    expect(snapshot(p)).toEqual(before);
  });

  it('refuses an unrelated folder that holds files, and an existing regular file', () => {
    const p = project('p-other');
    mkdirSync(join(p, 'measurements'));
    writeFileSync(join(p, 'measurements/unit7.s2p'), '# GHz S MA R 50\n1 0.1 0 0.9 0 0.9 0 0.1 0\n');
    writeFileSync(join(p, 'report.pdf'), 'not really a PDF');
    const before = snapshot(p);
    const a = run(['build', 'content', '--out', 'measurements', '--no-pdf', '--no-cache'], p);
    expect(a.status).toBe(1);
    expect(a.stderr).toContain('--out measurements: holds 1 entry but is not a site scatterbook built (it has no .scatterbook-site file)');
    const b = run(['build', 'content', '--out', 'report.pdf', '--no-pdf', '--no-cache'], p);
    expect(b.status).toBe(1);
    expect(b.stderr).toContain('--out report.pdf: is a file, not a folder');
    expect(snapshot(p)).toEqual(before);
  });

  it('builds into an absent or empty folder, writes its marker, and replaces a site it built', () => {
    const p = project('p-ok');
    mkdirSync(join(p, 'empty'));
    expect(run(['build', 'content', '--out', 'empty', '--no-pdf', '--no-cache'], p).status).toBe(0);
    expect(run(['build', 'content', '--out', 'fresh', '--no-pdf', '--no-cache'], p).status).toBe(0);
    expect(readFileSync(join(p, 'fresh/.scatterbook-site'), 'utf8')).toContain('built by scatterbook');
    writeFileSync(join(p, 'fresh/stale.html'), 'from an earlier build');
    expect(run(['build', 'content', '--out', 'fresh', '--no-pdf', '--no-cache'], p).status).toBe(0);
    expect(existsSync(join(p, 'fresh/stale.html'))).toBe(false);
    expect(existsSync(join(p, 'fresh/parts/vt-pad-10/index.html'))).toBe(true);
    expect(readFileSync(join(p, 'notes.txt'), 'utf8')).toBe("the user's own notes\n");
  });

  it('removes the staging and old folders that killed builds left behind, and only those', () => {
    const p = project('p-dead');
    expect(run(['build', 'content', '--out', 'site', '--no-pdf', '--no-cache'], p).status).toBe(0);
    // a process id that is not running (above the kernel's largest) and one that is (this test's)
    mkdirSync(join(p, '.site.building-4194999-1-aaaaaa/parts'), { recursive: true });
    mkdirSync(join(p, '.site.old-4194999-2-bbbbbb'));
    mkdirSync(join(p, `.site.building-${process.pid}-3-cccccc`));
    expect(run(['build', 'content', '--out', 'site', '--no-pdf', '--no-cache'], p).status).toBe(0);
    const left = readdirSync(p).filter((n) => n.startsWith('.site.'));
    expect(left).toEqual([`.site.building-${process.pid}-3-cccccc`]);
  });
});

describe('a mount point as the output folder is updated by swapping its contents', () => {
  it('builds twice into a tmpfs mount, keeping the mount itself', (ctx) => {
    const p = project('p-mount');
    mkdirSync(join(p, 'volume'));
    const m = spawnSync('mount', ['-t', 'tmpfs', '-o', 'size=64m', 'tmpfs', join(p, 'volume')]);
    if (m.status !== 0) {
      // mounting needs root; CI runs as root, so there this test always runs
      if (process.env.CI) throw new Error(`mount failed in CI: ${m.stderr}`);
      ctx.skip();
    }
    try {
      expect(run(['build', 'content', '--out', 'volume', '--no-pdf', '--no-cache'], p).status).toBe(0);
      const dev = lstatSync(join(p, 'volume')).dev;
      writeFileSync(join(p, 'volume/stale.html'), 'old');
      const r = run(['build', 'content', '--out', 'volume', '--no-pdf', '--no-cache'], p);
      expect(r.stderr).not.toMatch(/error/); // (the demo attenuator's damaged unit is warned about)
      expect(r.status).toBe(0);
      expect(lstatSync(join(p, 'volume')).dev).toBe(dev);
      expect(existsSync(join(p, 'volume/stale.html'))).toBe(false);
      expect(readdirSync(join(p, 'volume')).sort()).toEqual([
        '.scatterbook-site',
        'assets',
        'figures.csv',
        'figures.json',
        'index.html',
        'manifest.json',
        'parts',
      ]);
    } finally {
      spawnSync('umount', [join(p, 'volume')]);
    }
  });
});

/** A 2-port part of `units` units of `points` points each, written by our own writer. */
function densePart(name: string, units: number, points: number): string {
  const p = join(dir, name);
  mkdirSync(join(p, 'content/parts/dense/data'), { recursive: true });
  const ms: string[] = [];
  for (let u = 0; u < units; u++) {
    const f = new Float64Array(points);
    const s = new Float64Array(points * 8);
    for (let k = 0; k < points; k++) {
      f[k] = 1e9 + k * (1e9 / (points - 1));
      const a = 0.5 + 0.01 * u;
      s[8 * k] = 0.05; // S11
      s[8 * k + 2] = a; // S12
      s[8 * k + 4] = a; // S21
      s[8 * k + 6] = 0.05; // S22
    }
    writeFileSync(
      join(p, `content/parts/dense/data/u${u}.s2p`),
      writeTouchstone(makeNetwork(f, new Float64Array([50, 50]), s, 2), { version: '1.1', format: 'RI', frequencyUnit: 'GHz' }),
    );
    ms.push(`  - {unit: U${u}, file: data/u${u}.s2p}`);
  }
  writeFileSync(
    join(p, 'content/parts/dense/part.yaml'),
    `part: DN-1\nclass: attenuator\nmeasurements:\n${ms.join('\n')}\nbands:\n  all: {from: 1 GHz, to: 2 GHz}\nlimits:\n  - {figure: insertion-loss, on: S21, band: all, max: 7 dB}\n  - {figure: vswr, on: [S11, S22], band: all, max: 1.2}\n`,
  );
  return p;
}

describe('ordinary inputs that used to crash or hang the build', () => {
  it('a part with one measured unit builds, plots and all, and the process ends', () => {
    const p = densePart('one-unit', 1, 201);
    const r = run(['build', 'content', '--out', 'site', '--no-pdf', '--no-cache'], p);
    expect(r.signal).toBeNull();
    expect(r.stderr).toBe('');
    expect(r.status).toBe(0);
    const page = readFileSync(join(p, 'site/parts/dense/index.html'), 'utf8');
    expect(page.match(/<svg role="img"/g)?.length).toBeGreaterThan(0);
  });

  it('a dense sweep (2 units × 100,001 points) builds: no data-sized spread anywhere', () => {
    const p = densePart('dense', 2, 100_001);
    const r = run(['build', 'content', '--out', 'site', '--no-pdf'], p);
    expect(r.stderr).toBe('');
    expect(r.status).toBe(0);
    expect(existsSync(join(p, 'site/parts/dense/index.html'))).toBe(true);
  }, 120_000);

  it('a part file that is a folder is an error naming it, with and without the cache, and the build ends', () => {
    const p = project('p-folder');
    mkdirSync(join(p, 'content/parts/odd/part.yaml'), { recursive: true });
    for (const cache of [['--no-cache'], ['--cache', 'c']]) {
      const r = run(['build', 'content', '--out', 'site', '--no-pdf', ...cache], p);
      expect(r.status).toBe(1);
      expect(r.stderr).toContain('content/parts/odd/part.yaml: error: the part file is a folder, not a file');
    }
    const k = run(['build', 'content', '--out', 'site', '--no-pdf', '--keep-going', '--cache', 'c'], p);
    expect(k.status).toBe(1);
    expect(k.stdout).toContain('built 1 part, 1 left out with errors');
    rmSync(join(p, 'content/parts/odd'), { recursive: true });
  });
});
