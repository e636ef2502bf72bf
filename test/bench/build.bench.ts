/**
 * Benchmark: the HTML site of a synthetic catalog (npm run bench:build).
 * 200 parts cycling through a 2-port filter, a 3-port divider and a 4-port
 * coupler, 3 units each, 1,601 points per file, made by the demo models. It
 * prints the time per stage (read, figures, plots, pages), the total, the
 * peak memory, and the time of a rebuild after one part's YAML changed
 * (served from the content-hash cache for the other 199), then the PDF
 * throughput of the same pages in one browser (BENCH_PARTS sets the catalog's
 * size, e.g. 1000 or 2000, for the peak memory at scale). Not a test. It runs
 * the compiled code in dist/, as `scatterbook build` does (plots then render
 * in worker threads).
 */
import { spawnSync } from 'node:child_process';
import { existsSync, mkdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { addMeasurementNoise } from '../../src/demo/measurement.js';
import { bandpass } from '../../src/demo/models/bandpass.js';
import { coupledLine, wilkinson } from '../../src/demo/models/lines.js';
import { seeded } from '../../src/demo/random.js';
import { grid } from '../../src/demo/catalog.js';
import { buildCatalog } from '../../dist/pipeline/build-catalog.js';
import { newStageTimes } from '../../dist/pipeline/part.js';
import { writeSite } from '../../dist/site/eleventy-run.js';
import { renderedPages, renderSalt } from '../../dist/io/rendered-pages.js';
import { closePlotPool } from '../../dist/plots/pool.js';
import { findBrowser } from '../../dist/pdf/discover.js';
import { printAll } from '../../dist/pdf/print.js';
import { printJobs } from '../../dist/pdf/jobs.js';
import { writeTouchstone } from '../../src/touchstone/write.js';
import Eleventy from '@11ty/eleventy';

// BENCH_PARTS=200,1000,2000 runs one process per size (each with its own peak RSS) and prints them side by side
const SIZES = (process.env.BENCH_PARTS ?? '200').split(',').map(Number);
if (SIZES.length > 1) {
  const rows: string[] = [];
  for (const n of SIZES) {
    const r = spawnSync(process.execPath, [...process.execArgv, ...process.argv.slice(1)], {
      env: { ...process.env, BENCH_PARTS: String(n), BENCH_PDFS: '0' },
      encoding: 'utf8',
      stdio: ['ignore', 'pipe', 'inherit'],
    });
    process.stdout.write(r.stdout);
    const full = /full build: ([\d.]+) s total.*peak RSS so far (\d+) MB/.exec(r.stdout);
    const again = /rebuild after one part changed: ([\d.]+) s total.*peak RSS so far (\d+) MB/.exec(r.stdout);
    const cli = /scatterbook build \(the command, no cache\): ([\d.]+) s, peak RSS (\d+) MB/.exec(r.stdout);
    rows.push(
      `${String(n).padStart(6)} parts: scatterbook build ${cli?.[1] ?? '?'} s, peak RSS ${cli?.[2] ?? '?'} MB (goal: under 1,500 MB at 2,000 parts); ` +
        `in process, uncapped: full build ${full?.[1] ?? '?'} s, peak RSS ${full?.[2] ?? '?'} MB; rebuild ${again?.[1] ?? '?'} s, peak RSS ${again?.[2] ?? '?'} MB`,
    );
  }
  console.log(`\npeak memory by catalog size:\n${rows.join('\n')}`);
  process.exit(0);
}
const PARTS = SIZES[0];
const root = join(tmpdir(), `scatterbook-bench-catalog-${PARTS}`);
const content = join(root, 'content');

const KINDS = [
  {
    ports: 2,
    make: (s: number) => bandpass({ order: 5, rippleDb: 0.05, lowHz: 2.39e9, highHz: 2.51e9, q: 900, tolerance: 0.0015 }, grid(1e9, 4e9, 1601), seeded(s)),
    yaml: 'class: filter\nbands:\n  pass: {from: 2.40 GHz, to: 2.50 GHz}\n  stop: {from: 1.0 GHz, to: 2.2 GHz}\nlimits:\n  - {figure: insertion-loss, on: S21, band: pass, max: 2.5 dB}\n  - {figure: return-loss, on: [S11, S22], band: pass, min: 15 dB}\n  - {figure: rejection, on: S21, band: stop, min: 40 dB}\n  - {figure: group-delay, on: S21, band: pass, max: 20 ns}\n',
  },
  {
    ports: 3,
    make: (s: number) => wilkinson(2e9, 3.4, { a: 0.25, b: 0.03 }, { impedance: 0.01, length: 0.004, resistor: 0.01 }, grid(1e9, 3e9, 1601), seeded(s)),
    yaml: 'class: divider\nbands:\n  op: {from: 1.7 GHz, to: 2.3 GHz}\nlimits:\n  - {figure: insertion-loss, on: [S21, S31], band: op, max: 3.5 dB}\n  - {figure: amplitude-balance, on: [S21, S31], band: op, tolerance: 0.3 dB}\n  - {figure: phase-balance, on: [S21, S31], band: op, tolerance: 3 deg}\n  - {figure: isolation, on: S32, band: op, min: 18 dB}\n',
  },
  {
    ports: 4,
    make: (s: number) =>
      coupledLine(2e9, 20, { erEven: 6.5, erOdd: 6.35 }, { a: 0.3, b: 0.03 }, { impedance: 0.005, length: 0.003 }, grid(1e9, 3e9, 1601), seeded(s)),
    yaml: 'class: coupler\nbands:\n  op: {from: 1.5 GHz, to: 2.5 GHz}\nlimits:\n  - {figure: coupling, on: S31, band: op, nominal: 20 dB, tolerance: 1.5 dB}\n  - {figure: directivity, on: [S31, S41], band: op, min: 15 dB}\n  - {figure: mainline-loss, on: S21, band: op, max: 0.3 dB}\n  - {figure: return-loss, on: [S11, S22], band: op, min: 20 dB}\n',
  },
];

function generate(): void {
  if (existsSync(join(content, '.complete'))) return;
  rmSync(root, { recursive: true, force: true });
  for (let i = 0; i < PARTS; i++) {
    const kind = KINDS[i % KINDS.length];
    const slug = `bench-${String(i).padStart(3, '0')}`;
    mkdirSync(join(content, 'parts', slug, 'data'), { recursive: true });
    const ms: string[] = [];
    for (let u = 0; u < 3; u++) {
      const net = addMeasurementNoise(kind.make(i * 10 + u), -85, seeded(i * 100 + u));
      const file = `data/u${u}.s${kind.ports}p`;
      writeFileSync(join(content, 'parts', slug, file), writeTouchstone(net, { format: 'DB', significantDigits: 8 }));
      ms.push(`  - {unit: U${u}, file: ${file}}`);
    }
    writeFileSync(
      join(content, 'parts', slug, 'part.yaml'),
      `part: BENCH-${i}\ntitle: Synthetic part ${i}\nrevision: A\nmeasurements:\n${ms.join('\n')}\n${kind.yaml}`,
    );
  }
  writeFileSync(join(content, '.complete'), '');
}

const mb = (kb: number) => `${(kb / 1024).toFixed(0)} MB`;
const s = (ms: number) => `${(ms / 1000).toFixed(2)} s`;

console.log(`scatterbook site benchmark: ${PARTS} parts × 3 units × 1,601 points (2–4 ports), node ${process.version}`);
const tg = performance.now();
generate();
console.log(`catalog ready in ${s(performance.now() - tg)} (${root})`);
const cache = join(root, 'cache');
rmSync(cache, { recursive: true, force: true });

let lastTotal = 0;
async function build(label: string): Promise<void> {
  const times = newStageTimes();
  const t0 = performance.now();
  const spillDir = join(root, 'pages');
  rmSync(spillDir, { recursive: true, force: true });
  const b = await buildCatalog(content, { version: 'bench', cacheDir: cache, times, spillDir });
  const t1 = performance.now();
  // as scatterbook build does: unchanged parts' pages copied from those kept beside the cache
  rmSync(join(root, 'site'), { recursive: true, force: true });
  await writeSite(content, b.catalog, join(root, 'site'), {
    rendered: b.cacheBase ? renderedPages(join(cache, 'pages'), renderSalt(b.cacheBase, b.catalog)) : null,
  });
  times.pages = performance.now() - t1;
  const total = performance.now() - t0;
  lastTotal = total;
  if (b.catalog.failures.length) throw new Error(b.catalog.failures[0].messages.join('\n'));
  console.log(
    `${label}: ${s(total)} total — read ${s(times.read)}, figures ${s(times.figures)}, plots ${s(times.plots)}, pages ${s(times.pages)}; ` +
      `${b.cacheHits} parts from the cache; peak RSS so far ${mb(process.resourceUsage().maxRSS)}`,
  );
}

await build('full build');
const yaml = join(content, 'parts', 'bench-007', 'part.yaml');
writeFileSync(yaml, `${readFileSync(yaml, 'utf8')}# edited at ${Date.now()}\n`);
await build('rebuild after one part changed');
await closePlotPool();

// the same catalog through the command itself, whose build runs in a worker thread with a capped heap (bin/scatterbook.js):
// its peak RSS as /usr/bin/time reports it, where that is installed
if (existsSync('/usr/bin/time')) {
  const bin = join(import.meta.dirname, '../../bin/scatterbook.js');
  const r = spawnSync('/usr/bin/time', ['-f', '%e %M', process.execPath, bin, 'build', content, '--out', join(root, 'site-cli'), '--no-pdf', '--no-cache'], {
    encoding: 'utf8',
  });
  const [secs, kb] = (r.stderr.trim().split('\n').pop() ?? '').split(' ').map(Number);
  console.log(`scatterbook build (the command, no cache): ${secs.toFixed(1)} s, peak RSS ${mb(kb)} (exit ${r.status})`);
}

// the reference for a rebuild: Eleventy writing as many trivial pages (a datasheet and a report per part) with nothing else to do
{
  const dir = join(root, 'trivial');
  rmSync(dir, { recursive: true, force: true });
  mkdirSync(join(dir, 'in'), { recursive: true });
  writeFileSync(
    join(dir, 'in/page.njk'),
    '---\npagination:\n  data: items\n  size: 1\n  alias: item\npermalink: "p/{{ item }}/index.html"\n---\n<!doctype html><title>{{ item }}</title><p>{{ item }}</p>\n',
  );
  writeFileSync(join(dir, 'config.mjs'), "export default function () { return { templateFormats: ['njk'] }; }\n");
  const items = Array.from({ length: 2 * PARTS }, (_, i) => `page-${i}`);
  const t0 = performance.now();
  const elev = new Eleventy(join(dir, 'in'), join(dir, 'out'), {
    quietMode: true,
    configPath: join(dir, 'config.mjs'),
    config: (c) => c.addGlobalData('items', items),
  });
  (elev as unknown as { logger: { overrideLogger(l: unknown): void } }).logger.overrideLogger({ log() {}, info() {}, warn() {}, error() {} });
  await elev.write();
  const trivial = performance.now() - t0;
  console.log(`Eleventy writing ${2 * PARTS} trivial pages: ${s(trivial)}; the rebuild above took ${(lastTotal / trivial).toFixed(1)}× that (goal: within 2×)`);
}

// PDFs: print BENCH_PDFS datasheets (default 100) of the site just built, in one browser
const found = await findBrowser(undefined);
if (process.env.BENCH_PDFS === '0') console.log('PDFs: skipped (BENCH_PDFS=0)');
else if ('missing' in found) console.log(`PDFs: skipped (${found.missing})`);
else {
  const b = await buildCatalog(content, { version: 'bench', cacheDir: cache });
  const jobs = printJobs(b.catalog, join(root, 'site'), 'bench').slice(0, Number(process.env.BENCH_PDFS ?? 100));
  const r = await printAll(found, join(root, 'site'), jobs, { paper: 'A4', publicBase: '/' });
  console.log(
    `PDFs: ${r.printed} datasheets in ${s(r.printMs)} after a ${s(r.launchMs)} launch = ${(r.printed / (r.printMs / 1000)).toFixed(2)} PDFs per second (${r.browserVersion}, ${found.source})`,
  );
}
console.log('(stage times add up over parts built three at a time, with plots drawn in worker threads, so they sum to more than the total)');
