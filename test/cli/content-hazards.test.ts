/**
 * A content folder with every kind of broken file a real one gathers — data
 * files missing, empty, binary, folders, FIFOs, links out of the folder, in a
 * loop or to nothing; part files empty, binary, not UTF-8, folders — built in
 * one run through the real binary. Each bad part is one positioned error, the
 * build never crashes (no exit 4, no stack trace) or hangs, `--keep-going`
 * publishes the good part and lists every other one as failed, and without it
 * nothing is written.
 */
import { execFileSync, spawnSync } from 'node:child_process';
import { chmodSync, existsSync, mkdirSync, mkdtempSync, readFileSync, symlinkSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';

const BIN = join(import.meta.dirname, '../../bin/scatterbook.js');
let dir: string;
const GOOD_DATA = '# GHz S MA R 50\n1 0.1 0 0.9 -10 0.9 -10 0.1 0\n2 0.1 0 0.9 -20 0.9 -20 0.1 0\n3 0.1 0 0.9 -30 0.9 -30 0.1 0\n';
const yaml = (slug: string, file = 'data/u1.s2p') =>
  `part: ${slug.toUpperCase()}\ntitle: Hazard ${slug}\nrevision: A\nclass: attenuator\nmeasurements:\n  - {unit: U1, file: ${file}}\nbands:\n  b: {from: 1 GHz, to: 3 GHz}\nlimits:\n  - {figure: insertion-loss, on: S21, band: b, max: 2 dB}\n`;

/** slug → how its part is broken (undefined: it is the good one). */
const HAZARDS: Record<string, (partDir: string) => void> = {
  good: (p) => writeFileSync(join(p, 'data/u1.s2p'), GOOD_DATA),
  'data-missing': () => {},
  'data-empty': (p) => writeFileSync(join(p, 'data/u1.s2p'), ''),
  'data-binary': (p) => writeFileSync(join(p, 'data/u1.s2p'), Buffer.from(Array.from({ length: 4096 }, (_, i) => (i * 7919) % 256))),
  'data-folder': (p) => mkdirSync(join(p, 'data/u1.s2p')),
  'data-fifo': (p) => execFileSync('mkfifo', [join(p, 'data/u1.s2p')]),
  'data-link-outside': (p) => symlinkSync('/etc/hostname', join(p, 'data/u1.s2p')),
  'data-link-loop': (p) => {
    symlinkSync(join(p, 'data/b.s2p'), join(p, 'data/u1.s2p'));
    symlinkSync(join(p, 'data/u1.s2p'), join(p, 'data/b.s2p'));
  },
  'data-link-dangling': (p) => symlinkSync(join(p, 'data/nowhere.s2p'), join(p, 'data/u1.s2p')),
  'data-unreadable': (p) => {
    writeFileSync(join(p, 'data/u1.s2p'), GOOD_DATA);
    chmodSync(join(p, 'data/u1.s2p'), 0o000); // root reads it anyway: then the part builds, which is also right
  },
  'data-cut': (p) => writeFileSync(join(p, 'data/u1.s2p'), GOOD_DATA.slice(0, 70)),
};
/** Part files broken themselves (their text replaced). */
const BROKEN_PART_FILES: Record<string, (file: string) => void> = {
  'part-empty': (f) => writeFileSync(f, ''),
  'part-binary': (f) => writeFileSync(f, Buffer.from([0x7f, 0x45, 0x4c, 0x46, 0, 1, 2, 3, 0, 0, 0xff])),
  'part-latin1': (f) => writeFileSync(f, Buffer.from(yaml('part-latin1').replace('Hazard', 'Hazard \xe9'), 'latin1')),
  'part-folder': (f) => mkdirSync(f),
  'part-only-comments': (f) => writeFileSync(f, '# nothing here yet\n'),
  'part-a-list': (f) => writeFileSync(f, '- part: X\n- class: filter\n'),
  'part-a-scalar': (f) => writeFileSync(f, 'just words\n'),
  'part-tab-indent': (f) => writeFileSync(f, yaml('part-tab-indent').replace('  - {unit', '\t- {unit')),
};

function run(...args: string[]) {
  const r = spawnSync(process.execPath, [BIN, ...args], { cwd: dir, encoding: 'utf8', timeout: 120_000, env: { ...process.env, NO_COLOR: '1' } });
  return { status: r.status, stdout: r.stdout, stderr: r.stderr, signal: r.signal };
}

beforeAll(() => {
  dir = mkdtempSync(join(tmpdir(), 'scatterbook-hazards-'));
  for (const [slug, make] of Object.entries(HAZARDS)) {
    const p = join(dir, 'content/parts', slug);
    mkdirSync(join(p, 'data'), { recursive: true });
    writeFileSync(join(p, 'part.yaml'), yaml(slug));
    make(p);
  }
  for (const [slug, make] of Object.entries(BROKEN_PART_FILES)) {
    const p = join(dir, 'content/parts', slug);
    mkdirSync(p, { recursive: true });
    make(join(p, 'part.yaml'));
  }
  // a part folder that is a link to a folder outside the content folder
  const outside = join(dir, 'elsewhere');
  mkdirSync(join(outside, 'data'), { recursive: true });
  writeFileSync(join(outside, 'part.yaml'), yaml('part-folder-link'));
  writeFileSync(join(outside, 'data/u1.s2p'), GOOD_DATA);
  symlinkSync(outside, join(dir, 'content/parts/part-folder-link'));
  // a stray file among the part folders
  writeFileSync(join(dir, 'content/parts/README.txt'), 'notes for the team\n');
}, 30_000);

const rootUser = process.getuid?.() === 0;

describe('a content folder full of hazards', () => {
  it('without --keep-going: exit 1, one positioned error per bad part, no stack trace, nothing written', () => {
    const r = run('build', 'content', '--out', 'site', '--no-pdf', '--no-cache');
    expect(r.signal).toBeNull();
    expect(r.status, r.stderr).toBe(1);
    expect(r.stderr).not.toMatch(/^\s+at /m);
    expect(r.stderr).not.toContain('internal fault');
    expect(existsSync(join(dir, 'site'))).toBe(false);
    const bad = [...Object.keys(HAZARDS), ...Object.keys(BROKEN_PART_FILES)].filter((s) => s !== 'good' && !(s === 'data-unreadable' && rootUser));
    for (const slug of bad) expect(r.stderr, slug).toMatch(new RegExp(`parts/${slug}/[^\\s:]*(:\\d+(:\\d+)?)?: error: `));
    // each says what the file is, not only that something is wrong
    for (const [slug, says] of [
      ['data-empty', 'the file is empty (0 bytes)'],
      ['data-link-loop', 'is a symbolic link that leads round in a loop'],
      ['data-link-dangling', 'nowhere.s2p, which does not exist'],
      ['data-fifo', 'is a named pipe (FIFO), not a file'],
      ['data-binary', 'the file holds binary data'],
      ['data-link-outside', 'lies outside the content folder'],
      ['part-latin1', 'is not UTF-8'],
      ['part-a-list', 'must be a mapping (key: value), not a list'],
    ])
      expect(
        r.stderr.split('\n').find((l) => l.includes(`parts/${slug}/`)),
        slug,
      ).toContain(says);
  });

  it('with --keep-going: the good part published, every other one listed as failed on the index, exit 1', () => {
    const r = run('build', 'content', '--out', 'site', '--no-pdf', '--no-cache', '--keep-going');
    expect(r.signal).toBeNull();
    expect(r.status, r.stderr).toBe(1);
    expect(r.stderr).not.toMatch(/^\s+at /m);
    expect(existsSync(join(dir, 'site/parts/good/index.html'))).toBe(true);
    const index = readFileSync(join(dir, 'site/index.html'), 'utf8');
    for (const slug of [...Object.keys(HAZARDS), ...Object.keys(BROKEN_PART_FILES), 'part-folder-link'].filter(
      (s) => s !== 'good' && !(s === 'data-unreadable' && rootUser),
    )) {
      expect(index, slug).toContain(`parts/${slug}/`);
      expect(existsSync(join(dir, `site/parts/${slug}/index.html`)), slug).toBe(false);
    }
  });
});
