/**
 * Rendered pages kept from one build to the next: a part's datasheet and test
 * report as HTML, under a key of everything they are made from — the part's
 * page model (which holds the SHA-256 of its part file and every data file)
 * and a salt naming the build of scatterbook, its templates, the content
 * folder's template overrides, site.yaml and the catalog-wide values the
 * pages show. A rebuild copies an unchanged part's pages instead of rendering
 * them, and gets the same bytes a render would give (a test holds it so).
 * Entries are written atomically (a folder renamed into place); a part's
 * older entries are removed when a new one is kept.
 */
import { createHash } from 'node:crypto';
import { copyFileSync, existsSync, mkdirSync, readdirSync, renameSync, rmSync } from 'node:fs';
import { dirname, join } from 'node:path';
import type { Catalog, PartPage } from '../model/catalog.js';

export interface RenderedPages {
  /** Copies the part's pages into outDir when they were rendered from the same inputs; false (nothing copied) when not. */
  restore(page: PartPage, outDir: string): boolean;
  /** Keeps the part's pages just written into outDir for the next build. */
  keep(page: PartPage, outDir: string): void;
}

/** The site paths of a part's pages: its datasheet, and its test report where the site has reports. */
export const pagePaths = (page: PartPage): string[] => [`${page.url}index.html`, ...(page.reportUrl ? [page.reportUrl] : [])];

/** The page model without what names this build's temporary files (the SVGs' and the median's places, not their contents, which the inputs fix). */
function stableText(page: PartPage): string {
  const median = page.exports.median ? { url: page.exports.median.url } : null;
  return JSON.stringify({ ...page, plots: page.plots.map(({ svgFile: _file, svg: _svg, ...rest }) => rest), exports: { ...page.exports, median } });
}

/** The salt of a build's kept pages: the part cache's own key base (tool, site.yaml, overrides) and the catalog-wide values pages show. */
export const renderSalt = (cacheBase: string, catalog: Catalog): string =>
  JSON.stringify([cacheBase, catalog.site, catalog.generator, catalog.version, catalog.cpkMinUnits]);

export function renderedPages(dir: string, salt: string): RenderedPages {
  const keyOf = (page: PartPage) => createHash('sha256').update(salt).update('\0').update(stableText(page)).digest('hex').slice(0, 32);
  const entryOf = (page: PartPage) => join(dir, `${page.slug}-${keyOf(page)}`);
  return {
    restore(page, outDir) {
      const entry = entryOf(page);
      const paths = pagePaths(page);
      if (!paths.every((p) => existsSync(join(entry, p)))) return false;
      for (const p of paths) {
        mkdirSync(dirname(join(outDir, p)), { recursive: true });
        copyFileSync(join(entry, p), join(outDir, p));
      }
      return true;
    },
    keep(page, outDir) {
      const entry = entryOf(page);
      if (existsSync(entry)) return;
      const temp = `${entry}.tmp-${process.pid}`;
      rmSync(temp, { recursive: true, force: true });
      for (const p of pagePaths(page)) {
        mkdirSync(dirname(join(temp, p)), { recursive: true });
        copyFileSync(join(outDir, p), join(temp, p));
      }
      renameSync(temp, entry);
      const mine = new RegExp(`^${page.slug.replace(/[.*+?^${}()|[\]\\]/g, '\\$&')}-[0-9a-f]{32}$`);
      for (const name of readdirSync(dir)) if (mine.test(name) && join(dir, name) !== entry) rmSync(join(dir, name), { recursive: true, force: true });
    },
  };
}
