/**
 * The whole content folder → Catalog (its parts, then its comparisons), with
 * an optional cache of part pages by the hash of their inputs, and a progress
 * callback.
 */
import { openCache } from './cache.js';
import { assembleCatalog, partFolders, readSettings } from './catalog.js';
import { buildPartPage } from './part-page.js';
import type { StageTimes } from './part.js';
import { createHash } from 'node:crypto';
import { relative } from 'node:path';
import { formatSpecError } from '../part-file/diagnostics.js';
import { comparisonFiles, evaluateComparisonFile } from './comparison.js';
import { spillPage } from './spill.js';
import { buildComparisonPage } from './comparison-page.js';
import type { Catalog, ComparisonPage, PartFailure, PartPage } from '../model/catalog.js';

/**
 * buildPartPage, with a bug met on one part's way (an exception that is no fault of the machine, such as
 * a full disk, which stops the build) turned into that part's failure, so that --keep-going publishes the
 * others and lists it; the build still exits 4 and asks for a report.
 */
async function buildPartSafely(...args: Parameters<typeof buildPartPage>): Promise<Awaited<ReturnType<typeof buildPartPage>>> {
  try {
    return await buildPartPage(...args);
  } catch (e) {
    if ((e as NodeJS.ErrnoException).code) throw e;
    const file = relative(process.cwd(), args[0]) || args[0];
    const what = e instanceof Error ? (e.stack ?? e.message) : String(e);
    return {
      page: null,
      failure: {
        slug: args[2],
        file,
        internal: true,
        messages: [`${file}: internal error while building this part (a bug in scatterbook; please report it with this part file and its data):\n${what}`],
      },
    };
  }
}

export interface BuildCatalogOptions {
  readonly cacheDir?: string | null;
  readonly version: string;
  readonly onPart?: (done: number, total: number, slug: string) => void;
  readonly times?: StageTimes;
  /** Build slice K of N only (1-based): the parts shardOf assigns to it, and the comparisons in slice 1. */
  readonly shard?: { readonly k: number; readonly n: number } | null;
  /** Keep each page's SVGs and median text in files here until the pages are written (pipeline/spill.ts). */
  readonly spillDir?: string | null;
}

/** The slice (0-based) of N a part belongs to: the first 32 bits of the SHA-256 of its slug, modulo N — stable across machines and runs. */
export function shardOf(slug: string, n: number): number {
  return parseInt(createHash('sha256').update(slug).digest('hex').slice(0, 8), 16) % n;
}

export interface CatalogBuild {
  readonly catalog: Catalog;
  readonly settingsErrors: readonly string[];
  readonly cacheHits: number;
  /** With a cache: what keys its entries besides each part's files (for the rendered pages kept beside it). */
  readonly cacheBase: string | null;
}

export async function buildCatalog(contentRoot: string, options: BuildCatalogOptions): Promise<CatalogBuild> {
  const { settings, errors, text: settingsText } = readSettings(contentRoot);
  const shard = options.shard ?? null;
  const folders = partFolders(contentRoot).filter((f) => !shard || shardOf(f.slug, shard.n) === shard.k - 1);
  const pages: PartPage[] = [];
  const failures: PartFailure[] = [];
  let hits = 0;
  const cache = options.cacheDir ? openCache(options.cacheDir, contentRoot, settingsText) : null;
  // parts build a few at a time, so that plots drawn in worker threads overlap the next part's figures;
  // results keep the folders' order
  const results: Array<{ page: PartPage | null; failure: PartFailure | null }> = new Array(folders.length);
  let done = 0;
  let nextIndex = 0;
  const worker = async () => {
    while (nextIndex < folders.length) {
      const i = nextIndex++;
      const { slug, file } = folders[i];
      const cached = cache ? cache.read(slug, file) : null;
      const spill = (page: PartPage) => (options.spillDir ? spillPage(page, options.spillDir) : page);
      if (cached) {
        results[i] = { page: spill(cached), failure: null };
        hits++;
      } else {
        const b = await buildPartSafely(file, contentRoot, slug, settings, options.times, options.spillDir);
        if (b.page && cache) cache.write(slug, file, b.page);
        results[i] = b.page ? { page: spill(b.page), failure: null } : b;
      }
      done++;
      options.onPart?.(done, folders.length, slug);
    }
  };
  await Promise.all(Array.from({ length: 3 }, worker));
  for (const r of results) {
    if (r.page) pages.push(r.page);
    if (r.failure) failures.push(r.failure);
  }
  // comparisons read the parts they name afresh (their files are checked like any candidate's)
  const comparisons: ComparisonPage[] = [];
  for (const { slug, file } of shard && shard.k !== 1 ? [] : comparisonFiles(contentRoot)) {
    const display = relative(process.cwd(), file) || file;
    const outcome = await evaluateComparisonFile(file, contentRoot, display);
    if (outcome.errors.length || !outcome.comparison) {
      failures.push({
        slug: `comparisons/${slug}`,
        file: display,
        messages: outcome.errors.map((e) => formatSpecError(e, e.file === display ? outcome.source : undefined)),
      });
      continue;
    }
    comparisons.push(await buildComparisonPage(outcome, slug, contentRoot, file));
  }
  return {
    catalog: assembleCatalog(settings, pages, failures, options.version, comparisons),
    settingsErrors: errors,
    cacheHits: hits,
    cacheBase: cache?.base ?? null,
  };
}
