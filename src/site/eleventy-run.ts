/** Runs Eleventy on our pages with our configuration file, into a given folder. */
import { join } from 'node:path';
import Eleventy from '@11ty/eleventy';
import { copyLinkedFiles, PACKAGE_ROOT, PAGES_DIR, scatterbookSite } from './plugin.js';
import type { Catalog, PartPage } from '../model/catalog.js';
import type { RenderedPages } from '../io/rendered-pages.js';

/**
 * Parts per Eleventy run: Eleventy keeps every page it renders until its run
 * ends, so a large catalog is written in runs of this many parts (each run
 * also writes the index, from the whole catalog: the last one stands).
 * SCATTERBOOK_PAGE_BATCH sets another size (a smaller one caps memory lower).
 */
export const PAGE_BATCH = Number(process.env.SCATTERBOOK_PAGE_BATCH) >= 1 ? Math.floor(Number(process.env.SCATTERBOOK_PAGE_BATCH)) : 100;

export interface WriteSiteOptions {
  /** Parts per Eleventy run (PAGE_BATCH). */
  readonly batch?: number;
  /** Pages kept from earlier builds: an unchanged part's pages are copied instead of rendered (io/rendered-pages.ts). */
  readonly rendered?: RenderedPages | null;
}

export async function writeSite(content: string, catalog: Catalog, outDir: string, options: WriteSiteOptions = {}): Promise<void> {
  const batch = options.batch ?? PAGE_BATCH;
  const rendered = options.rendered ?? null;
  const { comparisons } = catalog.pages;
  let { parts, reports } = catalog.pages;
  if (rendered) {
    // the pages of parts rendered before from the same inputs are copied, with the files they link
    const again: PartPage[] = [];
    const copied: PartPage[] = [];
    for (const p of parts) (rendered.restore(p, outDir) ? copied : again).push(p);
    copyLinkedFiles(content, copied, outDir);
    const slugs = new Set(again.map((p) => p.slug));
    parts = again;
    reports = reports.filter((p) => slugs.has(p.slug));
  }
  if (parts.length <= batch) await writeRun(content, { ...catalog, pages: { parts, reports, comparisons } }, outDir);
  else {
    for (let i = 0; i < parts.length; i += batch) {
      const slice = parts.slice(i, i + batch);
      const slugs = new Set(slice.map((p) => p.slug));
      await writeRun(
        content,
        { ...catalog, pages: { parts: slice, reports: reports.filter((p) => slugs.has(p.slug)), comparisons: i === 0 ? comparisons : [] } },
        outDir,
      );
    }
  }
  if (rendered) for (const p of parts) rendered.keep(p, outDir);
}

async function writeRun(content: string, catalog: Catalog, outDir: string): Promise<void> {
  // the catalog goes to this run's plugin directly (no state shared between runs); the configuration file of
  // our own, which sets only the folders, keeps Eleventy from reading one in the user's working folder
  const elev = new Eleventy(PAGES_DIR, outDir, {
    quietMode: true,
    loader: 'esm',
    configPath: join(PACKAGE_ROOT, 'dist/site/eleventy-config.js'),
    config: (eleventyConfig) => scatterbookSite(eleventyConfig, { content, catalog }),
  });
  // Eleventy prints a summary line even in quiet mode; scatterbook prints its own. Its errors still throw from write().
  const quiet = { log() {}, info() {}, warn() {}, error() {} };
  (elev as unknown as { logger: { overrideLogger(l: unknown): void } }).logger.overrideLogger(quiet);
  // When two of Eleventy's writes fail at once (a full disk), one rejection is left unhandled and would end
  // the process; it is caught here and thrown as this write's error instead.
  const stray: unknown[] = [];
  const onStray = (e: unknown) => stray.push(e);
  process.on('unhandledRejection', onStray);
  try {
    await elev.init();
    // Eleventy's timing notes ("[11ty] Benchmark … Transform" on a slow machine) come from benchmark groups made
    // before quiet mode applies; they are Eleventy's notes to its developers, not to scatterbook's users
    const groups =
      (
        elev as unknown as { config?: { benchmarkManager?: { getAll(): Record<string, { setIsVerbose(v: boolean): void }> } } }
      ).config?.benchmarkManager?.getAll() ?? {};
    for (const g of Object.values(groups)) g.setIsVerbose(false);
    await elev.write();
    await new Promise((r) => setImmediate(r));
  } catch (e) {
    stray.unshift(e);
  } finally {
    process.off('unhandledRejection', onStray);
  }
  if (stray.length) throw stray[0];
}
