/**
 * Released revisions, through the binary on a copy of the demo catalog (whose
 * VT-BPF-2450 has revisions A and B released): a byte changed in a released
 * revision's data fails the build at the part's revision line and leaves the
 * site as it was; raising the revision builds, and the released PDFs are
 * carried unchanged and linked. `release` freezes a revision once. The record
 * format reads back what it wrote.
 */
import { spawnSync } from 'node:child_process';
import { cpSync, existsSync, mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import { changedSince, figureChanges, parseRecord, recordText, type ReleaseRecord } from '../../src/archive/release.js';
import { haveBrowser } from '../support/browser.js';
import { snapshot } from '../support/snapshot.js';

const ROOT = join(import.meta.dirname, '../..');
const BIN = join(ROOT, 'bin/scatterbook.js');
let dir: string;
const run = (args: string[]) => spawnSync(process.execPath, [BIN, ...args], { cwd: dir, encoding: 'utf8' });

beforeAll(() => {
  dir = mkdtempSync(join(tmpdir(), 'scatterbook-release-'));
  cpSync(join(ROOT, 'content'), join(dir, 'content'), { recursive: true });
});

const RECORD: ReleaseRecord = {
  part: 'X-1',
  revision: 'B',
  date: '2026-11-20',
  released: '2026-12-01T10:00:00.000Z',
  tool: 'scatterbook 0.1.0',
  fingerprint: '0123456789ab',
  spec: { path: 'part.yaml', sha256: 'a'.repeat(64) },
  data: [{ path: 'data/u1.s2p', sha256: 'b'.repeat(64) }],
  documents: [{ path: 'released/B/X-1.pdf', sha256: 'c'.repeat(64) }],
  figures: [
    { key: 'insertion-loss S21 over passband', worst: 1.8388080000000004, unit: 'dB', margin: 0.6611919999999996, pass: true },
    { key: 'bandwidth S21 over passband', worst: 1.2e8, unit: 'Hz', margin: null, pass: null },
  ],
};

describe('release records', () => {
  it('read back exactly what was written, numbers unrounded', () => {
    expect(parseRecord(recordText(RECORD))).toEqual({ value: RECORD });
    expect(parseRecord('part: X\nrevision B\n')).toEqual({ line: 2, message: 'expected "key: value"' });
  });

  it("say what changed since: a file's hash, a file added or removed; and how the figures moved", () => {
    expect(changedSince(RECORD, RECORD.spec, RECORD.data)).toEqual([]);
    expect(changedSince(RECORD, { path: 'part.yaml', sha256: 'd'.repeat(64) }, [...RECORD.data, { path: 'data/u2.s2p', sha256: 'e'.repeat(64) }])).toEqual([
      'part.yaml (SHA-256 aaaaaaaaaaaa… then, dddddddddddd… now)',
      'data/u2.s2p (added since)',
    ]);
    expect(figureChanges(RECORD.figures, [{ ...RECORD.figures[0], worst: 2.61, margin: -0.11, pass: false }])).toEqual([
      'insertion-loss S21 over passband: worst 1.84 dB → 2.61 dB, margin 0.66 dB → −0.11 dB, pass → fail',
      'bandwidth S21 over passband: no longer listed',
    ]);
    expect(figureChanges(RECORD.figures.slice(0, 1), [{ ...RECORD.figures[0], margin: 1.16 }])).toEqual([
      'insertion-loss S21 over passband: margin 0.66 dB → 1.16 dB (the limit changed)',
    ]);
  });
});

describe('a released revision never changes', () => {
  it('a byte changed in released data: the build fails at the revision line and the site stays; a raised revision builds and keeps the released PDFs and their links', () => {
    expect(run(['build', 'content', '--out', 'site', '--no-pdf', '--no-cache']).status).toBe(0);
    const released = readFileSync(join(dir, 'content/parts/vt-bpf-2450/released/B/VT-BPF-2450.pdf'));
    expect(readFileSync(join(dir, 'site/parts/vt-bpf-2450/released/B/VT-BPF-2450.pdf')).equals(released)).toBe(true);
    const page = readFileSync(join(dir, 'site/parts/vt-bpf-2450/index.html'), 'utf8');
    expect(page).toContain('href="../../parts/vt-bpf-2450/released/A/VT-BPF-2450.pdf"');
    expect(page).toContain('href="../../parts/vt-bpf-2450/released/B/VT-BPF-2450.pdf"');
    // from A to B the insertion-loss limit went from 3.0 dB to 2.5 dB
    expect(page).toMatch(/insertion-loss S21 over passband: margin 1\.16\s?dB → 0\.66\s?dB \(the limit changed\)/);
    const before = snapshot(join(dir, 'site'));
    const data = join(dir, 'content/parts/vt-bpf-2450/data/sn1002.s2p');
    const text = readFileSync(data, 'utf8');
    const lines = text.split('\n');
    lines[9] = lines[9].replace(/\d(\s*)$/, (d, s) => `${(Number(d[0]) + 1) % 10}${s}`);
    writeFileSync(data, lines.join('\n'));
    const r = run(['build', 'content', '--out', 'site', '--no-pdf']);
    expect(r.status).toBe(1);
    expect(r.stderr).toMatch(
      /^content\/parts\/vt-bpf-2450\/part\.yaml:6:11: error: revision B was released on \d{4}-\d{2}-\d{2} \(release-B\.txt\), and since then data\/sn1002\.s2p \(SHA-256 [0-9a-f]{12}… then, [0-9a-f]{12}… now\) changed; a released revision never changes: raise revision for the new one$/m,
    );
    expect(snapshot(join(dir, 'site'))).toEqual(before);
    const spec = join(dir, 'content/parts/vt-bpf-2450/part.yaml');
    writeFileSync(spec, readFileSync(spec, 'utf8').replace('revision: B', 'revision: C'));
    const c = run(['build', 'content', '--out', 'site', '--no-pdf']);
    expect(c.status, c.stderr).toBe(0);
    expect(readFileSync(join(dir, 'site/parts/vt-bpf-2450/released/B/VT-BPF-2450.pdf')).equals(released)).toBe(true);
    expect(readFileSync(join(dir, 'site/parts/vt-bpf-2450/index.html'), 'utf8')).toMatch(/C <span class="sub">\(this one\)<\/span>/);
    writeFileSync(data, text);
    writeFileSync(spec, readFileSync(spec, 'utf8').replace('revision: C', 'revision: B'));
  });

  it.skipIf(!haveBrowser)(
    "release freezes a revision once: documents and a record whose hashes are the files', and a second release is refused with nothing touched",
    () => {
      const r = run(['release', 'content/parts/vt-pad-10/part.yaml']);
      expect(r.stderr).toBe('');
      expect(r.status).toBe(0);
      expect(r.stdout).toMatch(
        /^released VT-PAD-10 revision A: content\/parts\/vt-pad-10\/release-A\.txt and content\/parts\/vt-pad-10\/released\/A\/ \(4 documents\); commit them with the part\n$/,
      );
      const record = parseRecord(readFileSync(join(dir, 'content/parts/vt-pad-10/release-A.txt'), 'utf8'));
      if (!('value' in record)) throw new Error(record.message);
      expect(record.value.documents.map((d) => d.path)).toEqual([
        'released/A/VT-PAD-10.pdf',
        'released/A/VT-PAD-10-report.pdf',
        'released/A/datasheet.html',
        'released/A/report.html',
      ]);
      const sha = (p: string) => spawnSync('sha256sum', [p], { encoding: 'utf8' }).stdout.split(' ')[0];
      for (const d of [...record.value.documents, ...record.value.data, record.value.spec])
        expect(d.sha256, d.path).toBe(sha(join(dir, 'content/parts/vt-pad-10', d.path)));
      expect(record.value.data.length).toBe(10);
      const before = snapshot(join(dir, 'content/parts/vt-pad-10'));
      const again = run(['release', 'content/parts/vt-pad-10/part.yaml']);
      expect(again.status).toBe(1);
      expect(again.stderr).toBe(
        'error: VT-PAD-10 revision A is already released (content/parts/vt-pad-10/release-A.txt); a released revision never changes: raise revision: for a new release\n',
      );
      expect(snapshot(join(dir, 'content/parts/vt-pad-10'))).toEqual(before);
      expect(existsSync(join(dir, 'content/parts/vt-pad-10/released/A/VT-PAD-10.pdf'))).toBe(true);
    },
    180_000,
  );
});
