/**
 * manifest.json and `scatterbook verify`, through the binary on a copy of
 * the demo catalog: the manifest names every part's spec and data files with
 * their SHA-256 (checked here against node's own hash of the bytes) and every
 * output file; verify passes a clean site and names a changed output file, a
 * changed data file and the figures that changed with it.
 */
import { spawnSync } from 'node:child_process';
import { createHash } from 'node:crypto';
import { appendFileSync, cpSync, mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';

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
  parts: Array<{ slug: string; part: string; revision: string; pass: boolean; fingerprint: string; spec: { path: string; sha256: string }; data: Array<{ unit: string; path: string; sha256: string }>; figures: { results: unknown[] } }>;
  comparisons: Array<{ slug: string; title: string; spec: { path: string; sha256: string }; data: unknown[] }>;
  outputs: Array<{ path: string; sha256: string; bytes: number }>;
}

describe('manifest.json', () => {
  it('has the documented keys; every input and output hash is the SHA-256 of the file\'s bytes; the fingerprint is on the pages', () => {
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
