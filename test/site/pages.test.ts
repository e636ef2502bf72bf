/**
 * The built demo site in a real browser (Debian's Chromium through
 * puppeteer-core) over a real local HTTP server: no console errors, no failed
 * requests, every plot has its traces and limit regions and is labelled for
 * screen readers; each datasheet's specification table (typical, min, max in
 * the row of its result) and each test report's compliance table (every unit
 * row) equal what `scatterbook figures --json` gives for that part; the
 * published Touchstone files download.
 */
import { spawnSync } from 'node:child_process';
import { mkdtempSync, readdirSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type { Browser } from 'puppeteer-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { haveBrowser, launch } from '../support/browser.js';
import { serveFolder, type StaticServer } from '../support/static-server.js';

const ROOT = join(import.meta.dirname, '../..');
const BIN = join(ROOT, 'bin/scatterbook.js');
const slugs = readdirSync(join(ROOT, 'content/parts'))
  .filter((d) => !d.startsWith('.'))
  .sort();
let out: string;
let server: StaticServer;
let browser: Browser;

beforeAll(async () => {
  out = join(mkdtempSync(join(tmpdir(), 'scatterbook-site-')), 'site');
  const r = spawnSync(process.execPath, [BIN, 'build', 'content', '--out', out, '--no-cache', '--no-pdf'], { cwd: ROOT, encoding: 'utf8' });
  if (r.status !== 0) throw new Error(`build failed: ${r.stderr}`);
  server = await serveFolder(out);
  if (haveBrowser) browser = await launch();
}, 180_000);

afterAll(async () => {
  await browser?.close();
  await server?.close();
});

interface FiguresJson {
  results: Array<{
    figure: string;
    limit: { max?: number; min?: number; nominal?: number; tolerance?: number } | null;
    typical: number;
    worst: number;
    worstAtHz: number | null;
    margin: number | null;
    pass: boolean | null;
    units: Array<{ unit: string; worst: number; atHz: number | null; margin: number | null; pass: boolean | null }>;
  }>;
}

/** What `scatterbook figures --json` says of a demo part. */
function figuresJson(slug: string): FiguresJson {
  const cli = spawnSync(process.execPath, [BIN, 'figures', join(ROOT, 'content/parts', slug, 'part.yaml'), '--json'], { encoding: 'utf8' });
  return JSON.parse(cli.stdout) as FiguresJson;
}

interface PageReport {
  errors: string[];
  failed: string[];
}

async function open(path: string): Promise<{ page: import('puppeteer-core').Page; report: PageReport }> {
  const page = await browser.newPage();
  const report: PageReport = { errors: [], failed: [] };
  page.on('console', (m) => m.type() === 'error' && report.errors.push(m.text()));
  page.on('pageerror', (e) => report.errors.push(String(e)));
  page.on('requestfailed', (r) => report.failed.push(r.url()));
  page.on('response', (r) => r.status() >= 400 && report.failed.push(`${r.status()} ${r.url()}`));
  await page.goto(server.url + path, { waitUntil: 'networkidle0' });
  return { page, report };
}

describe.skipIf(!haveBrowser)('the demo site in Chromium', () => {
  it('the catalog index lists every part, grouped by class, with a link that works', async () => {
    const { page, report } = await open('index.html');
    const rows = await page.$$eval('.class-group:not(.comparisons) .catalog-table tbody tr th a', (as) =>
      as.map((a) => [a.textContent, a.getAttribute('href')]),
    );
    expect(rows.length).toBe(slugs.length);
    const groups = await page.$$eval('.class-group:not(.comparisons) h2', (hs) => hs.map((h) => h.textContent));
    expect(groups.length).toBeGreaterThanOrEqual(8);
    await page.click('.class-group:not(.comparisons) .catalog-table tbody tr th a');
    await page.waitForSelector('#part-number');
    expect(report.errors).toEqual([]);
    expect(report.failed).toEqual([]);
    await page.close();
  });

  it('the comparison page: listed on the index, no console errors, its embedded JSON is compare --json, every cell and rank equals it, one style per candidate in plots and table, the gap said', async () => {
    const index = await open('index.html');
    const link = await index.page.$eval('.comparisons .catalog-table tbody tr th a', (a) => a.getAttribute('href'));
    expect(link).toBe('comparisons/ism-filter-shortlist/index.html');
    await index.page.close();
    const { page, report } = await open('comparisons/ism-filter-shortlist/index.html');
    const cli = JSON.parse(
      spawnSync(process.execPath, [BIN, 'compare', join(ROOT, 'content/comparisons/ism-filter-shortlist.yaml'), '--json'], { encoding: 'utf8' }).stdout,
    );
    const embedded = JSON.parse(await page.$eval('#comparison-json', (e) => e.textContent ?? ''));
    expect(embedded).toEqual(cli);
    const cells = await page.$$eval('.candidates-table tbody tr', (trs) =>
      trs.map((tr) =>
        Array.from(tr.querySelectorAll('td.cell')).map((td) => (td.getAttribute('data-value') === null ? null : Number(td.getAttribute('data-value')))),
      ),
    );
    cli.candidates.forEach((c: { coverage: string; results: Array<{ worst: number }> }, k: number) => {
      cells.forEach((row, i) => {
        if (c.coverage === 'full') expect(row[k], `candidate ${k} check ${i}`).toBe(c.results[i].worst);
        else expect(row[k]).toBe(null);
      });
    });
    const ranks = await page.$$eval('.rank-row td[data-candidate]', (tds) => tds.map((td) => td.textContent?.trim() ?? ''));
    expect(ranks.map((r) => (r.startsWith('—') ? null : Number(r)))).toEqual(cli.candidates.map((c: { rank: number | null }) => c.rank));
    // a failing cell says so in words, not by colour alone
    const failing = await page.$$eval('td.cell.failing', (tds) => tds.map((td) => td.textContent ?? ''));
    expect(failing.length).toBeGreaterThan(0);
    for (const t of failing) expect(t).toContain('FAIL');
    // every plot: one legend key per candidate, the same colour and dash as the table's header
    const heads = await page.$$eval('.candidates-table thead th[data-candidate] line', (ls) =>
      ls.map((l) => `${l.getAttribute('stroke')} ${l.getAttribute('stroke-dasharray')}`),
    );
    expect(new Set(heads).size).toBe(cli.candidates.length);
    const legends = await page.$$eval('.plots figure.plot', (fs) =>
      fs.map((f) => Array.from(f.querySelectorAll('figcaption .key line')).map((l) => `${l.getAttribute('stroke')} ${l.getAttribute('stroke-dasharray')}`)),
    );
    expect(legends.length).toBeGreaterThanOrEqual(4);
    for (const l of legends) expect(l.slice(0, cli.candidates.length)).toEqual(heads);
    // each candidate's median drawn (one line each), the requirement's regions shaded
    const plots = await page.$$eval('.plots figure.plot > svg', (ss) =>
      ss.map((s) => ({ median: s.querySelectorAll('.median_traces_marks path').length, regions: s.querySelectorAll('.limit_regions_marks path').length })),
    );
    for (const p of plots) {
      expect(p.median).toBeGreaterThanOrEqual(2);
      expect(p.regions).toBeGreaterThan(0);
    }
    const gap = (await page.$eval('.gap-note', (p) => p.textContent ?? '')).replace(/\u00a0|\u202f/g, ' ');
    expect(gap).toContain('data cover 2.4 GHz to 2.47 GHz of ism');
    expect(await page.$$eval('.differences figure.plot', (fs) => fs.length)).toBeGreaterThanOrEqual(3);
    expect(report.errors).toEqual([]);
    expect(report.failed).toEqual([]);
    await page.close();
  });

  for (const slug of slugs) {
    it(`${slug} datasheet: its sections, plots with traces and limit regions, specification numbers equal figures --json, data files that download`, async () => {
      const { page, report } = await open(`parts/${slug}/index.html`);
      for (const id of ['part-number', 'headline-title', 'plots-title', 'ports-title', 'ratings-title']) {
        expect(await page.$(`#${id}`), `${slug}: section #${id}`).not.toBeNull();
      }
      // what the customer's datasheet leaves to the test report
      for (const id of ['compliance-title', 'measurements-title', 'quality-title'])
        expect(await page.$(`#${id}`), `${slug}: no #${id} on the datasheet`).toBeNull();
      const plots = await page.$$eval('figure.plot > svg', (svgs) =>
        svgs.map((s) => ({
          title: s.querySelector('title')?.textContent ?? '',
          desc: s.querySelector('desc')?.textContent ?? '',
          role: s.getAttribute('role'),
          median: s.querySelectorAll('.median_traces_marks path, .smith_traces_marks path').length,
          regions:
            s.querySelectorAll('.limit_regions_marks path').length +
            s.querySelectorAll('.series_limit_edges_marks line, .series_limit_edges_marks path').length,
        })),
      );
      expect(plots.length, `${slug}: plots`).toBeGreaterThanOrEqual(2);
      for (const p of plots) {
        expect(p.role).toBe('img');
        expect(p.title.length).toBeGreaterThan(3);
        expect(p.desc).toContain('measured unit');
        expect(p.median, `${slug} ${p.title}: traces`).toBeGreaterThan(0);
      }
      expect(
        plots.some((p) => p.regions > 0),
        `${slug}: some plot shows limits`,
      ).toBe(true);
      // the specification table: typical and limits in the row of their result
      const json = figuresJson(slug);
      const rows = await page.$$eval('tr.spec-row[data-result]', (trs) =>
        trs.map((tr) => {
          const num = (key: string) => {
            const v = tr.querySelector(`[data-key="${key}"]`)?.getAttribute('data-value');
            return v === null || v === undefined ? null : Number(v);
          };
          return { result: Number(tr.getAttribute('data-result')), min: num('min'), typ: num('typical'), max: num('max') };
        }),
      );
      expect(rows.length, `${slug}: specification rows`).toBeGreaterThan(0);
      for (const row of rows) {
        const r = json.results[row.result];
        const l = r.limit ?? {};
        const two = l.tolerance !== undefined && l.nominal !== undefined;
        expect(row.typ, `${slug} ${r.figure} typical`).toBe(r.typical);
        expect(row.min, `${slug} ${r.figure} min`).toBe(two ? (l.nominal as number) - (l.tolerance as number) : (l.min ?? null));
        expect(row.max, `${slug} ${r.figure} max`).toBe(two ? (l.nominal as number) + (l.tolerance as number) : (l.max ?? null));
      }
      const links = await page.$$eval('.data-files a', (as) => as.map((a) => (a as HTMLAnchorElement).href));
      expect(links.length, `${slug}: S-parameter data links`).toBeGreaterThan(0);
      for (const href of links) {
        const res = await fetch(href);
        expect(res.status, href).toBe(200);
        expect((await res.text()).includes('#'), `${href} is a Touchstone file`).toBe(true);
      }
      expect(report.errors).toEqual([]);
      expect(report.failed).toEqual([]);
      await page.close();
    });

    it(`${slug} test report: every unit row, and every compliance number equals figures --json`, async () => {
      const { page, report } = await open(`parts/${slug}/report.html`);
      for (const id of ['part-number', 'compliance-title', 'measurements-title', 'quality-title']) {
        expect(await page.$(`#${id}`), `${slug}: section #${id}`).not.toBeNull();
      }
      // the compliance numbers against the CLI's JSON for the same part
      const json = figuresJson(slug);
      const table = await page.$$eval('tbody.check', (bodies) =>
        bodies.map((b) => {
          const num = (row: Element, key: string) => {
            const c = row.querySelector(`[data-key="${key}"]`);
            const v = c?.getAttribute('data-value');
            return v === null || v === undefined ? null : Number(v);
          };
          const summary = b.querySelector('tr.summary') as Element;
          return {
            typical: num(summary, 'typical'),
            worst: num(summary, 'worst'),
            at: num(summary, 'at'),
            margin: num(summary, 'margin'),
            verdict: summary.querySelector('.verdict')?.textContent,
            units: Array.from(b.querySelectorAll('tr.unit')).map((u) => ({
              unit: u.getAttribute('data-unit'),
              worst: num(u, 'worst'),
              at: num(u, 'at'),
              margin: num(u, 'margin'),
              verdict: u.querySelector('.verdict')?.textContent,
            })),
          };
        }),
      );
      expect(table.length).toBe(json.results.length);
      const same = (a: number | null, b: number | null) => (b === null || !Number.isFinite(b) ? a === null : a === b);
      json.results.forEach((r, i) => {
        const row = table[i];
        expect(same(row.typical, r.typical), `${slug} row ${i} typical`).toBe(true);
        expect(same(row.worst, r.worst), `${slug} row ${i} worst`).toBe(true);
        expect(same(row.at, r.worstAtHz), `${slug} row ${i} at`).toBe(true);
        expect(same(row.margin, r.margin), `${slug} row ${i} margin`).toBe(true);
        expect(row.verdict).toBe(r.pass === null ? 'report' : r.pass ? 'PASS' : 'FAIL');
        r.units.forEach((u, j) => {
          expect(row.units[j].unit).toBe(u.unit);
          expect(
            same(row.units[j].worst, u.worst) && same(row.units[j].at, u.atHz) && same(row.units[j].margin, u.margin),
            `${slug} row ${i} unit ${u.unit}`,
          ).toBe(true);
        });
      });
      expect(report.errors).toEqual([]);
      expect(report.failed).toEqual([]);
      await page.close();
    });
  }
});
