/**
 * PDF datasheets printed by a real Chromium (Debian's, installed by .ci/run),
 * checked with poppler's pdfinfo, pdftotext and pdftoppm: page count, metadata
 * from the part (title, author, keywords, dates), the part number on every
 * page, every compliance value present, no text outside the page, a first
 * page that is not blank; requests outside the build folder refused; and what
 * happens without a browser.
 */
import { execFileSync, spawn, spawnSync } from 'node:child_process';
import { createServer } from 'node:http';
import type { AddressInfo } from 'node:net';
import { cpSync, existsSync, mkdirSync, mkdtempSync, readdirSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import { coarsestResolutionHz } from '../../src/format/units.js';
import { formatValue as formatValueAt } from '../../src/format/values.js';
import { readTouchstone } from '../../src/touchstone/read.js';
import { haveBrowser } from '../support/browser.js';

const ROOT = join(import.meta.dirname, '../..');
const BIN = join(ROOT, 'bin/scatterbook.js');
const havePoppler = spawnSync('pdfinfo', ['-v']).status === 0;
if (!havePoppler && process.env.CI) throw new Error('PDF tests need poppler-utils in CI: apt-get install -y poppler-utils');
const slugs = readdirSync(join(ROOT, 'content/parts'))
  .filter((d) => !d.startsWith('.'))
  .sort();
let dir: string;
let build: { status: number | null; stdout: string; stderr: string };

function run(args: string[], env: Record<string, string | undefined> = {}) {
  const r = spawnSync(process.execPath, [BIN, ...args], { cwd: dir, encoding: 'utf8', env: { ...process.env, ...env } });
  return { status: r.status, stdout: r.stdout, stderr: r.stderr };
}

const info = (pdf: string) =>
  Object.fromEntries(
    execFileSync('pdfinfo', ['-isodates', pdf], { encoding: 'utf8' })
      .split('\n')
      .filter((l) => l.includes(':'))
      .map((l) => [l.slice(0, l.indexOf(':')).trim(), l.slice(l.indexOf(':') + 1).trim()]),
  );

beforeAll(() => {
  dir = mkdtempSync(join(tmpdir(), 'scatterbook-pdf-'));
  if (haveBrowser) build = run(['build', join(ROOT, 'content'), '--out', 'site', '--no-cache', '--pdf']);
}, 300_000);

describe.skipIf(!haveBrowser || !havePoppler)('PDF datasheets', () => {
  it('the build prints one PDF per part and the pages link them', () => {
    expect(build.stderr.split('\n').filter((l) => l && !l.startsWith('warning: VT-PAD-10 fails'))).toEqual([]); // the demo's one failing unit is warned about
    expect(build.status).toBe(0);
    expect(build.stdout).toMatch(/built 8 parts and 1 comparison, 17 PDFs \([\d.]+ per second after the browser started\)/);
    const index = readFileSync(join(dir, 'site/index.html'), 'utf8');
    for (const slug of slugs) expect(index).toContain(`href="parts/${slug}/${slug.toUpperCase()}.pdf"`);
    for (const slug of slugs) expect(existsSync(join(dir, 'site/parts', slug, `${slug.toUpperCase()}-report.pdf`)), `${slug} report PDF`).toBe(true);
    expect(readFileSync(join(dir, 'site/parts/vt-bpf-2450/index.html'), 'utf8')).toContain('href="../../parts/vt-bpf-2450/VT-BPF-2450.pdf"');
  });

  /** The part with the most plots and rows, allowed three datasheet pages; every other datasheet fits in two (issue 10's page budget). */
  const LARGEST = 'vt-amp-0560';

  for (const slug of slugs) {
    it(`${slug}: the datasheet in at most ${slug === LARGEST ? 3 : 2} pages and the test report: metadata, part number on every page, every specification and compliance value, text inside the page, a first page that is not blank`, () => {
      const part = slug.toUpperCase();
      const yaml = readFileSync(join(ROOT, 'content/parts', slug, 'part.yaml'), 'utf8');
      const title = /^title: (.*)$/m.exec(yaml)?.[1] as string;
      const date = /^date: (.*)$/m.exec(yaml)?.[1] as string;
      const json = JSON.parse(execFileSync(process.execPath, [BIN, 'figures', join(ROOT, 'content/parts', slug, 'part.yaml'), '--json'], { encoding: 'utf8' }));
      const check = (pdf: string, what: string, maxPages: number) => {
        const meta = info(pdf);
        expect(meta.Title).toBe(`${part} — ${title}${what === 'datasheet' ? '' : ` (${what})`}`);
        expect(meta.Author).toBe('Veltrane Microwave');
        expect(meta.Keywords).toContain(part);
        expect(meta.CreationDate).toBe(`${date}T00:00:00Z`); // the part's date, not the clock
        expect(meta['Page size']).toContain('(A4)');
        const pages = Number(meta.Pages);
        expect(pages, `${part} ${what} pages`).toBeGreaterThanOrEqual(1);
        expect(pages, `${part} ${what} pages`).toBeLessThanOrEqual(maxPages);
        for (let p = 1; p <= pages; p++) {
          const text = execFileSync('pdftotext', ['-f', String(p), '-l', String(p), '-layout', pdf, '-'], { encoding: 'utf8' });
          expect(text, `${part} page ${p}`).toContain(part);
          expect(text).toContain(`page ${p} of ${pages}`);
        }
        // no word outside the page box
        const bbox = execFileSync('pdftotext', ['-bbox', pdf, '-'], { encoding: 'utf8' });
        const page = /<page width="([\d.]+)" height="([\d.]+)"/.exec(bbox) as RegExpExecArray;
        const [w, h] = [Number(page[1]), Number(page[2])];
        for (const m of bbox.matchAll(/<word xMin="([\d.-]+)" yMin="([\d.-]+)" xMax="([\d.-]+)" yMax="([\d.-]+)">([^<]*)</g)) {
          const [x0, y0, x1, y1] = [m[1], m[2], m[3], m[4]].map(Number);
          expect(x0 >= 0 && y0 >= 0 && x1 <= w && y1 <= h, `${part}: "${m[5]}" at ${x0},${y0}–${x1},${y1} leaves the ${w}×${h} page`).toBe(true);
        }
        // the first page, rendered, is not blank
        const pgm = execFileSync('pdftoppm', ['-f', '1', '-l', '1', '-r', '30', '-gray', pdf], { maxBuffer: 1 << 26 });
        const hm = /^P5\s+(\d+)\s+(\d+)\s+255\s/.exec(pgm.subarray(0, 50).toString('latin1')) as RegExpExecArray;
        const pixels = pgm.subarray(hm[0].length);
        let ink = 0;
        for (const px of pixels) if (px < 200) ink++;
        expect(ink / pixels.length).toBeGreaterThan(0.01);
        // whole tokens ("0.25" does not match "10.25"), in table order from a heading on
        const layout = execFileSync('pdftotext', ['-layout', pdf, '-'], { encoding: 'utf8' });
        return (heading: RegExp) => {
          const table = layout.slice(layout.search(heading)).replace(/\s+/g, ' ');
          expect(table.length, `${part} ${what}: ${heading}`).toBeGreaterThan(20);
          let pos = 0;
          return (text: string, label: string) => {
            const re = new RegExp(`(?<=^| )${text.replace(/[.*+?^${}()|[\]\\]/g, '\\$&')}(?= |$)`, 'g');
            re.lastIndex = pos;
            const m = re.exec(table);
            expect(m, `${part} ${what} ${label}: ${text} after position ${pos}`).not.toBeNull();
            pos = (m as RegExpExecArray).index + text.length;
          };
        };
      };

      // the datasheet: the specification table's typical values, as the page prints them, in its row order
      const sheet = check(join(dir, 'site/parts', slug, `${part}.pdf`), 'datasheet', slug === LARGEST ? 3 : 2);
      const html = readFileSync(join(dir, 'site/parts', slug, 'index.html'), 'utf8');
      const next = sheet(/^\s*Electrical specifications\s*$/m);
      const typicals = [...html.matchAll(/<td class="num" data-key="typical" data-value="([^"]+)">([^<]*)<\/td>/g)];
      expect(typicals.length, `${part}: typical values in the specification table`).toBeGreaterThan(0);
      for (const m of typicals) next(m[2].replace(/\s+/g, ' '), `typical ${m[1]}`);

      // the test report: typical, worst, margin of each row, then the worst and margin of each of its units
      // (frequency figures to the resolution of the coarsest measured grid, as the pages show them)
      const grids = readdirSync(join(ROOT, 'content/parts', slug, 'data')).map(
        (f) => readTouchstone(readFileSync(join(ROOT, 'content/parts', slug, 'data', f)), { fileName: f }).value?.network.freqHz,
      );
      const res = coarsestResolutionHz(grids.filter((g): g is Float64Array => g !== undefined));
      const formatValue = (v: number, unit: string) => formatValueAt(v, unit, res);
      const inReport = check(join(dir, 'site/parts', slug, `${part}-report.pdf`), 'test report', 8)(/^\s*Compliance\s*$/m);
      for (const r of json.results as Array<{
        figure: string;
        unit: string;
        typical: number;
        worst: number;
        margin: number | null;
        units: Array<{ unit: string; worst: number; margin: number | null }>;
      }>) {
        inReport(formatValue(r.typical, r.unit), `${r.figure} typical`);
        inReport(formatValue(r.worst, r.unit), `${r.figure} worst`);
        if (r.margin !== null) inReport(formatValue(r.margin, r.unit), `${r.figure} margin`);
        for (const u of r.units) {
          inReport(formatValue(u.worst, r.unit), `${r.figure} ${u.unit} worst`);
          if (u.margin !== null) inReport(formatValue(u.margin, r.unit), `${r.figure} ${u.unit} margin`);
        }
      }
    });
  }

  it('the comparison as a PDF: its metadata, the title on every page, every worst value and rank of compare --json, text inside the page (poppler)', () => {
    const pdf = join(dir, 'site/comparisons/ism-filter-shortlist/ism-filter-shortlist-comparison.pdf');
    expect(existsSync(pdf)).toBe(true);
    const meta = info(pdf);
    expect(meta.Title).toBe('Filter shortlist for a 2.4 GHz ISM front end (comparison)');
    expect(meta.Keywords).toContain('Orrin OR-BP24');
    const pages = Number(meta.Pages);
    expect(pages).toBeGreaterThanOrEqual(2);
    const text = execFileSync('pdftotext', ['-layout', pdf, '-'], { encoding: 'utf8' });
    const perPage = text.split('\f').filter((t) => t.trim());
    expect(perPage.length).toBe(pages);
    for (const t of perPage) expect(t).toContain('Filter shortlist for a 2.4 GHz ISM front end');
    const json = JSON.parse(run(['compare', join(ROOT, 'content/comparisons/ism-filter-shortlist.yaml'), '--json']).stdout);
    const flat = text.replace(/\s+/g, ' ');
    for (const c of json.candidates) {
      expect(flat).toContain(c.label);
      for (const r of c.results) expect(flat, `${c.label} ${r.figure} worst`).toContain(formatValueAt(r.worst, r.unit));
    }
    expect(flat).toMatch(/Rank 2 1 3 — not ranked/);
    // nothing drawn outside the page: pdftotext's bounding boxes all inside the media box
    const boxes = execFileSync('pdftotext', ['-bbox', pdf, '-'], { encoding: 'utf8' });
    const page = /<page width="([\d.]+)" height="([\d.]+)"/.exec(boxes) as RegExpExecArray;
    for (const m of boxes.matchAll(/xMax="([\d.]+)" yMax="([\d.]+)"/g)) {
      expect(Number(m[1])).toBeLessThanOrEqual(Number(page[1]));
      expect(Number(m[2])).toBeLessThanOrEqual(Number(page[2]));
    }
  });

  it('a page asking for the network or a file outside the build folder: refused, reported, and the PDF still prints', () => {
    const content = join(dir, 'leaky');
    mkdirSync(join(content, 'parts'), { recursive: true });
    cpSync(join(ROOT, 'content/parts/vt-pad-10'), join(content, 'parts/vt-pad-10'), { recursive: true });
    mkdirSync(join(content, '_includes'));
    writeFileSync(
      join(content, '_includes/notes.njk'),
      '<img src="https://example.invalid/tracker.png" alt=""><link rel="stylesheet" href="file:///etc/hostname"><img src="../../../../secret.png" alt="">\n',
    );
    const r = run(['build', 'leaky', '--out', 'leaky-site', '--no-cache', '--pdf']);
    expect(r.status).toBe(0);
    expect(r.stderr).toContain('parts/vt-pad-10/index.html asked for https://example.invalid/tracker.png, which was refused');
    expect(r.stderr).toContain('asked for file:///etc/hostname, which was refused');
    expect(r.stderr).toMatch(/asked for file:\/\/\/[^ ]*secret\.png, which was refused/);
    expect(Number(info(join(dir, 'leaky-site/parts/vt-pad-10/VT-PAD-10.pdf')).Pages)).toBeGreaterThanOrEqual(1);
  });
});

describe('WebSockets, which pass request interception', () => {
  it.skipIf(!haveBrowser)(
    'a page that opens one to a local port reaches nothing, and the build reports it',
    async () => {
      let connections = 0;
      const server = createServer((_, res) => res.end('x'));
      server.on('connection', () => connections++);
      await new Promise<void>((ok) => server.listen(0, '127.0.0.1', ok));
      const port = (server.address() as AddressInfo).port;
      const content = join(dir, 'socket');
      mkdirSync(join(content, 'parts'), { recursive: true });
      cpSync(join(ROOT, 'content/parts/vt-pad-10'), join(content, 'parts/vt-pad-10'), { recursive: true });
      mkdirSync(join(content, '_includes'));
      writeFileSync(
        join(content, '_includes/notes.njk'),
        `<script>new WebSocket('ws://127.0.0.1:${port}/leak'); fetch('http://127.0.0.1:${port}/leak2').catch(() => {});</script>\n`,
      );
      const r = await new Promise<{ status: number | null; stderr: string }>((ok) => {
        const child = spawn(process.execPath, [BIN, 'build', 'socket', '--out', 'socket-site', '--no-cache', '--pdf'], { cwd: dir });
        let stderr = '';
        child.stderr.on('data', (d) => (stderr += d));
        child.on('close', (status) => ok({ status, stderr }));
      });
      server.close();
      expect(r.status).toBe(0);
      expect(r.stderr).toContain(`parts/vt-pad-10/index.html asked for ws://127.0.0.1:${port}/leak, which was refused`);
      expect(r.stderr).toContain(`asked for http://127.0.0.1:${port}/leak2, which was refused`);
      expect(connections).toBe(0);
    },
    120_000,
  );
});

describe('without a browser', () => {
  it('the HTML still builds and the build exits 0 with a message saying how to get PDFs; --pdf exits 1', () => {
    mkdirSync(join(dir, 'nb/parts'), { recursive: true });
    cpSync(join(ROOT, 'content/parts/vt-pad-10'), join(dir, 'nb/parts/vt-pad-10'), { recursive: true });
    const env = { SCATTERBOOK_NO_BROWSER_SEARCH: '1', SCATTERBOOK_BROWSER: undefined };
    const r = run(['build', 'nb', '--out', 'nb-site', '--no-cache'], env);
    expect(r.status).toBe(0);
    expect(r.stderr).toContain(
      'note: no browser given, and SCATTERBOOK_NO_BROWSER_SEARCH forbids looking for one, so the site is built without PDFs; to print PDFs, install Chromium',
    );
    expect(existsSync(join(dir, 'nb-site/parts/vt-pad-10/index.html'))).toBe(true);
    expect(existsSync(join(dir, 'nb-site/parts/vt-pad-10/VT-PAD-10.pdf'))).toBe(false);
    const strict = run(['build', 'nb', '--out', 'nb-strict', '--no-cache', '--pdf'], env);
    expect(strict.status).toBe(1);
    expect(strict.stderr).toContain('error: PDFs are required (--pdf) but no browser given');
    expect(existsSync(join(dir, 'nb-strict'))).toBe(false);
    expect(run(['build', 'nb', '--out', 'x', '--browser', '/nonexistent/chrome']).stderr).toContain('--browser /nonexistent/chrome: no such file');
  });
});
