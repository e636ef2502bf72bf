/**
 * manifest.json and `scatterbook verify`, through the binary on a copy of
 * the demo catalog: the manifest names every part's spec and data files with
 * their SHA-256 (checked here against node's own hash of the bytes) and every
 * output file; verify passes a clean site and names a changed output file, a
 * changed data file and the figures that changed with it; the exports (CSV
 * read back by Python's csv module against the JSON, the median file against
 * numpy.median).
 */
import { spawnSync } from 'node:child_process';
import { createHash } from 'node:crypto';
import { appendFileSync, cpSync, mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import { readTouchstone } from '../../src/touchstone/read.js';
import { PYTHON } from '../support/prerequisites.js';

const ROOT = join(import.meta.dirname, '../..');
const BIN = join(ROOT, 'bin/scatterbook.js');
let dir: string;
const run = (args: string[]) => spawnSync(process.execPath, [BIN, ...args], { cwd: dir, encoding: 'utf8' });
const sha = (path: string) => createHash('sha256').update(readFileSync(path)).digest('hex');

beforeAll(() => {
  dir = mkdtempSync(join(tmpdir(), 'scatterbook-verify-'));
  cpSync(join(ROOT, 'content'), join(dir, 'content'), { recursive: true });
  const r = run(['build', 'content', '--out', 'site', '--no-pdf', '--no-cache']);
  if (r.status !== 0) throw new Error(r.stderr);
}, 120_000);

interface Manifest {
  manifestVersion: number;
  tool: { name: string; version: string };
  parts: Array<{
    slug: string;
    part: string;
    revision: string;
    pass: boolean;
    fingerprint: string;
    spec: { path: string; sha256: string };
    data: Array<{ unit: string; path: string; sha256: string }>;
    figures: { results: unknown[] };
  }>;
  comparisons: Array<{ slug: string; title: string; spec: { path: string; sha256: string }; data: unknown[] }>;
  outputs: Array<{ path: string; sha256: string; bytes: number }>;
}

describe('manifest.json', () => {
  it("has the documented keys; every input and output hash is the SHA-256 of the file's bytes; the fingerprint is on the pages", () => {
    const m = JSON.parse(readFileSync(join(dir, 'site/manifest.json'), 'utf8')) as Manifest;
    expect(Object.keys(m)).toEqual(['manifestVersion', 'tool', 'parts', 'comparisons', 'outputs']);
    expect(m.tool.name).toBe('scatterbook');
    expect(m.parts.length).toBe(8);
    expect(Object.keys(m.parts[0])).toEqual(['slug', 'fingerprint', 'spec', 'data', 'part', 'revision', 'pass', 'figures']);
    for (const p of m.parts) {
      expect(p.spec.sha256).toBe(sha(join(dir, 'content', p.spec.path)));
      for (const d of p.data) expect(d.sha256).toBe(sha(join(dir, 'content', d.path)));
      expect(p.fingerprint).toMatch(/^[0-9a-f]{12}$/);
      expect(readFileSync(join(dir, 'site/parts', p.slug, 'index.html'), 'utf8')).toContain(p.fingerprint);
      // the figures are those of figures --json
      const cli = JSON.parse(run(['figures', join('content', p.spec.path), '--json']).stdout);
      expect(p.figures).toEqual(cli);
    }
    expect(m.comparisons.map((c) => c.slug)).toEqual(['ism-filter-shortlist']);
    for (const o of m.outputs) {
      expect(o.sha256).toBe(sha(join(dir, 'site', o.path)));
      expect(o.bytes).toBe(readFileSync(join(dir, 'site', o.path)).length);
    }
    expect(m.outputs.map((o) => o.path)).toContain('parts/vt-bpf-2450/index.html');
    expect(m.outputs.map((o) => o.path)).not.toContain('manifest.json');
  });
});

describe('scatterbook verify', () => {
  it('a clean site and its content: exit 0, and it says how much it checked', () => {
    const r = run(['verify', 'site', 'content']);
    expect(r.stderr).toBe('');
    expect(r.status).toBe(0);
    expect(r.stdout).toMatch(/^checked \d+ output files, \d+ input files and \d+ figures: all as the manifest says\n$/);
  });

  it('a changed output file, a changed data file and the figures it moves: each named, exit 1', () => {
    const page = join(dir, 'site/parts/vt-pad-10/index.html');
    const before = readFileSync(page);
    appendFileSync(page, '<!-- edited -->');
    const data = join(dir, 'content/parts/vt-bpf-2450/data/sn1001.s2p');
    const original = readFileSync(data, 'utf8');
    // the first data line's S21 magnitude (DB format: the third value) made 1 dB lower
    const lines = original.split('\n');
    const k = lines.findIndex((l) => /^\s*[\d.]/.test(l) && Number(l.trim().split(/\s+/)[0]) >= 2.45);
    const v = lines[k].trim().split(/\s+/);
    v[3] = String(Number(v[3]) - 1);
    lines[k] = v.join(' ');
    writeFileSync(data, lines.join('\n'));
    const r = run(['verify', 'site', 'content']);
    expect(r.status).toBe(1);
    expect(r.stderr).toContain('differs: parts/vt-pad-10/index.html: changed (SHA-256 ');
    expect(r.stderr).toContain('differs: parts/vt-bpf-2450/data/sn1001.s2p: input changed (SHA-256 ');
    expect(r.stderr).toMatch(/differs: parts\/vt-bpf-2450\/part\.yaml: insertion-loss S21 over passband: worst [\d.]+ published, [\d.]+ now/);
    // without the content folder only the outputs are checked
    expect(run(['verify', 'site']).stderr.split('\n').filter(Boolean)).toEqual([expect.stringContaining('parts/vt-pad-10/index.html: changed')]);
    writeFileSync(page, before);
    writeFileSync(data, original);
    expect(run(['verify', 'site', 'content']).status).toBe(0);
  });

  it('no manifest: exit 1 with one message', () => {
    const r = run(['verify', 'content']);
    expect(r.status).toBe(1);
    expect(r.stderr).toBe('error: content: manifest.json is missing: this is not a site scatterbook built (or it was built before manifests)\n');
  });
});

describe('exports', () => {
  it("figures.csv of the catalog, read back by Python's csv module (an independent parser), equals figures.json row for row, numbers unrounded", () => {
    const script = `import csv, json, sys
rows = list(csv.DictReader(open(sys.argv[1], newline='', encoding='utf-8')))
print(json.dumps(rows))`;
    const rows = JSON.parse(spawnSync(PYTHON, ['-c', script, join(dir, 'site/figures.csv')], { encoding: 'utf8' }).stdout) as Array<Record<string, string>>;
    const all = JSON.parse(readFileSync(join(dir, 'site/figures.json'), 'utf8')) as {
      parts: Array<{
        part: string;
        revision: string;
        results: Array<Record<string, unknown> & { units: Array<Record<string, unknown>>; on: string[]; limit: Record<string, number> | null }>;
      }>;
    };
    const text = (v: unknown) => (v === null || v === undefined ? '' : String(v));
    const expected = all.parts.flatMap((p) =>
      p.results.flatMap((r) =>
        r.units.map((u) => ({
          part: p.part,
          revision: p.revision,
          figure: r.figure,
          on: r.on.join(' '),
          band: r.band,
          worst: text(r.worst),
          margin: text(r.margin),
          measurement: text(u.unit),
          measurement_worst: text(u.worst),
          measurement_at_hz: text(u.atHz),
          limit_max: text(r.limit?.max),
        })),
      ),
    );
    expect(rows.length).toBe(expected.length);
    expect(rows.length).toBeGreaterThan(100);
    rows.forEach((row, i) => {
      for (const [k, v] of Object.entries(expected[i])) expect(row[k], `row ${i + 1} ${k}`).toBe(v);
      expect(Number(row.measurement_worst)).toBe(expected[i].measurement_worst === 'Infinity' ? Infinity : Number(expected[i].measurement_worst));
    });
    // per part: the part's own rows, and its figures.json is figures --json
    const own = readFileSync(join(dir, 'site/parts/vt-bpf-2450/figures.csv'), 'utf8').trim().split('\r\n');
    expect(own.length - 1).toBe(rows.filter((r) => r.part === 'VT-BPF-2450').length);
    expect(JSON.parse(readFileSync(join(dir, 'site/parts/vt-bpf-2450/figures.json'), 'utf8'))).toEqual(
      JSON.parse(run(['figures', 'content/parts/vt-bpf-2450/part.yaml', '--json']).stdout),
    );
  });

  it("the median Touchstone file is marked derived and equals numpy.median of the units' real and imaginary parts", () => {
    const path = join(dir, 'site/parts/vt-bpf-2450/VT-BPF-2450-median.s2p');
    const text = readFileSync(path, 'utf8');
    expect(text.split('\n')[0]).toMatch(/^! DERIVED DATA, not a measurement: the median of 4 measurements of VT-BPF-2450/);
    const median = readTouchstone(readFileSync(path), { fileName: 'median.s2p' }).value!.network;
    const files = ['sn1001', 'sn1002', 'sn1003', 'sn1004'].map((s) => join(dir, `content/parts/vt-bpf-2450/data/${s}.s2p`));
    const script = `import json, sys, numpy as np
def read(p):
    rows = [l.split('!')[0].split() for l in open(p) if l.strip() and not l.startswith(('!', '#'))]
    a = np.array([[float(x) for x in r] for r in rows])
    mag = 10 ** (a[:, 1::2] / 20); ang = np.deg2rad(a[:, 2::2])
    return mag * np.cos(ang), mag * np.sin(ang)
re = np.median([read(p)[0] for p in sys.argv[1:]], axis=0); im = np.median([read(p)[1] for p in sys.argv[1:]], axis=0)
print(json.dumps([re.tolist(), im.tolist()]))`;
    const [re, im] = JSON.parse(spawnSync(PYTHON, ['-c', script, ...files], { encoding: 'utf8' }).stdout) as number[][][];
    // the files hold DB format in v1 order S11 S21 S12 S22; our S is row-major S11 S12 S21 S22
    const order = [0, 2, 1, 3];
    re.forEach((row, k) =>
      row.forEach((v, e) => {
        expect(Math.abs(median.s[2 * (k * 4 + order[e])] - v)).toBeLessThan(1e-12);
        expect(Math.abs(median.s[2 * (k * 4 + order[e]) + 1] - im[k][e])).toBeLessThan(1e-12);
      }),
    );
  });
});
