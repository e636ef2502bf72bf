/**
 * `scatterbook build [CONTENT_DIR] [--out DIR] [--no-pdf] [--keep-going]`:
 * a content folder → a static datasheet site. Nothing partial is published:
 * the site is built in a staging folder and swapped in only when every part
 * built (or, with --keep-going, with the good parts and a list of the others).
 */
import { existsSync, readFileSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { join, relative, resolve } from 'node:path';
import { printable } from '../format/escape.js';
import { planAssets } from '../io/assets.js';
import { describeFault } from '../io/fault.js';
import { outputRefusal } from '../io/output-folder.js';
import { discard, pagesFolder, removeDeadBuilds, stagingFolder, swapInto } from '../io/swap.js';
import { buildCatalog } from '../pipeline/build-catalog.js';
import { partFolders } from '../pipeline/catalog.js';
import { toolBuildId } from '../pipeline/cache.js';
import { sealSite } from '../archive/seal.js';
import { closePlotPool } from '../plots/pool.js';
import { writeSite } from '../site/eleventy-run.js';
import { PACKAGE_ROOT } from '../site/plugin.js';
import { findBrowser, HOW_TO_GET_PDFS, type FoundBrowser } from '../pdf/discover.js';
import { printAll } from '../pdf/print.js';
import { printJobs, withPdfLinks } from '../pdf/jobs.js';
import { parseArgs, UsageError, type FlagSpec, type ParsedArgs } from './args.js';
import { EXIT, type Command } from './command.js';
import { progress } from './progress.js';
import { painter, type Terminal } from './terminal.js';
import type { Catalog } from '../model/catalog.js';
import { renderedPages, renderSalt } from '../io/rendered-pages.js';

export const BUILD_FLAGS: FlagSpec[] = [
  { name: 'out', value: true, help: 'the output folder (default _site)' },
  { name: 'keep-going', help: 'publish the parts that build, and list the ones that do not' },
  { name: 'no-pdf', help: 'do not print PDF datasheets' },
  { name: 'pdf', help: 'PDFs are required: fail (exit 1) when no browser can print them' },
  { name: 'browser', value: true, help: 'the Chromium-family browser that prints PDFs (or set SCATTERBOOK_BROWSER)' },
  { name: 'no-cache', help: 'recompute every part (by default unchanged parts come from the cache)' },
  { name: 'cache', value: true, help: 'the cache folder (default .scatterbook-cache beside the output)' },
  { name: 'strict', help: 'exit 3 when a published part fails a limit (the site is still written)' },
  { name: 'shard', value: true, help: 'build slice K of N of the parts (e.g. 2/4), for scatterbook merge to join' },
];

/** The record a sharded build leaves in its output for `scatterbook merge`. */
export const SHARD_RECORD = '.scatterbook-shard.json';

export function packageVersion(): string {
  return (JSON.parse(readFileSync(join(PACKAGE_ROOT, 'package.json'), 'utf8')) as { version: string }).version;
}

export interface BuildOptions {
  readonly content: string;
  readonly out: string;
  readonly keepGoing: boolean;
  readonly cacheDir: string | null;
  /** off: no PDFs; auto: PDFs when a browser is found; required: no browser is an error. */
  readonly pdf: 'off' | 'auto' | 'required';
  readonly browser: string | undefined;
  /** Slice K of N (1-based), or null for the whole catalog. */
  readonly shard?: { readonly k: number; readonly n: number } | null;
}

function parseShard(v: string | true | undefined): { k: number; n: number } | null {
  if (v === undefined) return null;
  const m = typeof v === 'string' ? /^(\d+)\/(\d+)$/.exec(v) : null;
  const k = m ? Number(m[1]) : NaN,
    n = m ? Number(m[2]) : NaN;
  if (!m || !(n >= 1) || !(k >= 1) || k > n) throw new UsageError(`--shard ${String(v)}: expected K/N with 1 ≤ K ≤ N, e.g. --shard 2/4`);
  return { k, n };
}

export function buildOptions(
  argv: readonly string[],
  t: Terminal,
  flags: readonly FlagSpec[] = BUILD_FLAGS,
): BuildOptions & { flags: Map<string, string | true> } {
  return buildOptionsOf(parseArgs(argv, flags), t);
}

/** Build options from parsed arguments (serve parses its own, with more flags). */
export function buildOptionsOf(args: ParsedArgs, t: Terminal): BuildOptions & { flags: Map<string, string | true> } {
  if (args.positionals.length > 1) throw new UsageError('takes at most one content folder');
  const content = resolve(t.cwd, args.positionals[0] ?? 'content');
  const out = resolve(t.cwd, (args.flags.get('out') as string | undefined) ?? '_site');
  const cacheFlag = args.flags.get('cache');
  const cacheDir = args.flags.has('no-cache') ? null : resolve(t.cwd, typeof cacheFlag === 'string' ? cacheFlag : join(out, '..', '.scatterbook-cache'));
  if (args.flags.has('pdf') && args.flags.has('no-pdf')) throw new UsageError('--pdf and --no-pdf contradict each other');
  const pdf = args.flags.has('no-pdf') ? 'off' : args.flags.has('pdf') ? 'required' : 'auto';
  return {
    content,
    out,
    keepGoing: args.flags.has('keep-going'),
    cacheDir,
    pdf,
    browser: args.flags.get('browser') as string | undefined,
    shard: parseShard(args.flags.get('shard')),
    flags: args.flags,
  };
}

export interface BuildOutcome {
  readonly code: 0 | 1 | 4;
  readonly parts: number;
  /** Parts left out with errors. */
  readonly failed: number;
  /** Published parts that fail a limit. */
  readonly failing: number;
  readonly ms: number;
}

export async function runBuild(o: BuildOptions, t: Terminal): Promise<BuildOutcome> {
  const p = painter(t.stderr, t.env);
  const started = performance.now();
  const rel = (x: string) => relative(t.cwd, x) || '.';
  const fail = (message: string) => {
    t.stderr.write(`${p.red('error:')} ${message}\n`);
    return { code: 1 as const, parts: 0, failed: 0, failing: 0, ms: performance.now() - started };
  };
  const shownOut = rel(o.out).startsWith('..') ? o.out : rel(o.out);
  const refusal = outputRefusal(o.out, { content: o.content, cwd: t.cwd, home: t.env.HOME }, shownOut);
  if (refusal) return fail(refusal);
  if (o.cacheDir && existsSync(o.cacheDir) && !statSync(o.cacheDir).isDirectory())
    return fail(`--cache ${rel(o.cacheDir)}: is a file, not a folder; name a folder (it is created when missing) or pass --no-cache`);
  removeDeadBuilds(o.out);
  try {
    return await buildAndPublish(o, t, started);
  } catch (e) {
    const fault = describeFault(e, rel, `writing the new site for ${shownOut}`);
    if (fault === null) throw e;
    return fail(`${fault}; nothing was published (${rel(o.out)} is unchanged)`);
  } finally {
    await closePlotPool();
  }
}

async function buildAndPublish(o: BuildOptions, t: Terminal, started: number): Promise<BuildOutcome> {
  // the pages' SVGs and median files wait here until the pages are written, not in memory (pipeline/spill.ts)
  const spillDir = pagesFolder(o.out);
  try {
    return await buildWith(o, t, started, spillDir);
  } finally {
    rmSync(spillDir, { recursive: true, force: true });
  }
}

/** A part met a bug of scatterbook (exit 4, even when --keep-going published the others). */
const internalFault = (catalog: Catalog) => catalog.failures.some((f) => f.internal);

async function buildWith(o: BuildOptions, t: Terminal, started: number, spillDir: string): Promise<BuildOutcome> {
  const p = painter(t.stderr, t.env);
  const bar = progress(t);
  const rel = (x: string) => relative(t.cwd, x) || '.';
  const built = await buildCatalog(o.content, {
    version: packageVersion(),
    cacheDir: o.cacheDir,
    shard: o.shard ?? null,
    spillDir,
    onPart: (done, total, slug) => bar.update(`parts ${done}/${total}  ${printable(slug)}`),
  });
  bar.done();
  await closePlotPool();
  const { catalog } = built;
  const siteErrors = [...built.settingsErrors, ...planAssets(o.content, rel).errors];
  const problems = [...siteErrors, ...catalog.failures.flatMap((f) => f.messages)];
  for (const m of problems) t.stderr.write(`${m}\n`);
  // a slice may hold no part at all (more slices than parts); a whole build needs one
  const none = catalog.parts.length === 0 && !(o.shard && partFolders(o.content).length > 0);
  if (siteErrors.length || (catalog.failures.length && !o.keepGoing) || none) {
    const files = catalog.failures.length + siteErrors.length;
    const why =
      catalog.parts.length === 0 && !catalog.failures.length && !siteErrors.length
        ? `no parts found: expected ${rel(join(o.content, 'parts'))}/<slug>/part.yaml`
        : `${files} file${files === 1 ? '' : 's'} with errors`;
    t.stderr.write(
      `${p.red('error:')} ${why}; nothing was written (${rel(o.out)} is unchanged)${catalog.failures.length && !o.keepGoing ? '; --keep-going publishes the parts that build' : ''}\n`,
    );
    return {
      code: internalFault(catalog) ? EXIT.internal : 1,
      parts: catalog.parts.length,
      failed: catalog.failures.length,
      failing: 0,
      ms: performance.now() - started,
    };
  }
  // PDFs need a browser; look for it before the pages are written, since they link their PDFs
  let found: FoundBrowser | null = null;
  if (o.pdf !== 'off') {
    const f = await findBrowser(o.browser, t.env as NodeJS.ProcessEnv);
    if ('missing' in f) {
      if ('named' in f) {
        t.stderr.write(`${p.red('error:')} ${f.missing}; name a Chromium-family browser, or pass --no-pdf; nothing was written (${rel(o.out)} is unchanged)\n`);
        return { code: 1, parts: catalog.parts.length, failed: catalog.failures.length, failing: 0, ms: performance.now() - started };
      }
      if (o.pdf === 'required') {
        t.stderr.write(`${p.red('error:')} PDFs are required (--pdf) but ${f.missing}; ${HOW_TO_GET_PDFS}; nothing was written (${rel(o.out)} is unchanged)\n`);
        return { code: 1, parts: catalog.parts.length, failed: catalog.failures.length, failing: 0, ms: performance.now() - started };
      }
      t.stderr.write(`${p.yellow('note:')} ${f.missing}, so the site is built without PDFs; ${HOW_TO_GET_PDFS}\n`);
    } else found = f;
  }
  const site = found ? withPdfLinks(catalog) : catalog;
  bar.update(`pages for ${site.parts.length} parts`);
  const staging = stagingFolder(o.out);
  let pdfNote = '';
  try {
    // unchanged parts' pages come from the last build's, kept beside the cache under the same key and the catalog-wide values they show
    const rendered = o.cacheDir && built.cacheBase ? renderedPages(join(o.cacheDir, 'pages'), renderSalt(built.cacheBase, site)) : null;
    await writeSite(o.content, site, staging.dir, { rendered });
    if (found) {
      const report = await printAll(found, staging.dir, printJobs(site, staging.dir, packageVersion()), {
        paper: site.site.paper,
        publicBase: site.site.baseUrl,
        onDone: (done, total) => bar.update(`PDFs ${done}/${total}`),
      });
      bar.done();
      for (const r of report.refused)
        t.stderr.write(
          `${p.yellow('warning:')} ${printable(r.page)} asked for ${printable(r.url)}, which was refused: pages may load only files of the site\n`,
        );
      const rate = report.printed / Math.max(report.printMs / 1000, 1e-3);
      pdfNote = `, ${report.printed} PDF${report.printed === 1 ? '' : 's'} (${rate.toFixed(1)} per second after the browser started)`;
    }
    // a slice records what merge needs to join it without rendering anything again
    if (o.shard)
      writeFileSync(
        join(staging.dir, SHARD_RECORD),
        JSON.stringify({ format: 1, shard: o.shard, tool: toolBuildId(), version: packageVersion(), content: o.content, catalog: site }),
      );
    // last: the marker, the exports and the manifest, which hashes every file the site holds
    sealSite(site, staging.dir, packageVersion());
    swapInto(staging);
  } catch (e) {
    discard(staging);
    throw e;
  } finally {
    bar.done();
  }
  const ms = performance.now() - started;
  const failed = catalog.failures.length;
  let failing = 0;
  for (const page of catalog.parts) {
    for (const w of page.warnings) t.stderr.write(`${printable(w.where)}: ${p.yellow('warning:')} ${printable(w.message)}\n`);
    const rows = page.compliance.filter((r) => r.verdict === 'FAIL');
    if (rows.length) failing++;
    for (const r of rows) {
      t.stderr.write(
        `${p.yellow('warning:')} ${printable(page.part)} fails ${printable(r.label)} on ${printable(r.on)} over ${printable(r.band)}: worst ${r.worst.text} (${printable(r.worstUnit)}${r.at.value !== null ? ` at ${r.at.text}` : ''}) against ${r.limit}\n`,
      );
    }
  }
  t.stdout.write(
    `built ${o.shard ? `slice ${o.shard.k}/${o.shard.n}: ` : ''}${catalog.parts.length} part${catalog.parts.length === 1 ? '' : 's'}${catalog.comparisons.length ? ` and ${catalog.comparisons.length} comparison${catalog.comparisons.length === 1 ? '' : 's'}` : ''}${pdfNote}${failed ? `, ${failed} left out with errors` : ''}${built.cacheHits ? ` (${built.cacheHits} unchanged, from the cache)` : ''} into ${rel(o.out)}/ in ${(ms / 1000).toFixed(1)} s; open ${rel(join(o.out, 'index.html'))}\n`,
  );
  return { code: internalFault(catalog) ? EXIT.internal : failed ? 1 : 0, parts: catalog.parts.length, failed, failing, ms };
}

export const buildCommand: Command = {
  name: 'build',
  usage: 'scatterbook build [CONTENT_DIR] [--out DIR] [--keep-going] [--strict] [--no-pdf | --pdf] [--browser PATH] [--no-cache] [--cache DIR] [--shard K/N]',
  flags: BUILD_FLAGS,
  async run(argv, t) {
    const o = buildOptions(argv, t);
    const r = await runBuild(o, t);
    if (r.code !== 0) return r.code === EXIT.internal ? EXIT.internal : EXIT.badInput;
    return o.flags.has('strict') && r.failing > 0 ? EXIT.limitFailed : EXIT.ok;
  },
};
