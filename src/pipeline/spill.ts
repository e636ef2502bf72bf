/**
 * The bulky parts of a page model — its plots' SVG and its median Touchstone
 * text, a few hundred kilobytes a part — kept in files of a build's own
 * temporary folder from the moment the part is built until the page is
 * written, so that a build's memory does not grow with its catalog: the page
 * models in memory hold the files' paths. The cache keeps its entries' texts
 * the same way, in files beside them.
 */
import { mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import type { PartPage } from '../model/catalog.js';

/**
 * The page with its SVGs and median text moved into files under dir, named
 * `<stem>-<plot id>.svg` and `<stem>-median.txt` (stem: the slug, or the
 * cache's entry name); `write` writes a file (the cache writes atomically).
 */
export function spillPage(
  page: PartPage,
  dir: string,
  stem: string = page.slug,
  write: (path: string, data: string | Uint8Array) => void = writeFileSync,
  /** Copy SVGs that wait in files elsewhere into dir too (the cache keeps its own copies); else they stay where they are. */
  copyFiles = false,
): PartPage {
  mkdirSync(dir, { recursive: true });
  const plots = page.plots.map((p) => {
    const file = join(dir, `${stem}-${p.id}.svg`);
    if (p.svg) write(file, p.svg);
    // an SVG its worker wrote to a file already (plot-blocks.ts) is copied when it is to live elsewhere, e.g. in the cache
    else if (copyFiles && p.svgFile && p.svgFile !== file) write(file, readFileSync(p.svgFile));
    else return p;
    return { ...p, svg: '', svgFile: file };
  });
  let median = page.exports.median;
  if (median && median.text) {
    const file = join(dir, `${stem}-median.txt`);
    write(file, median.text);
    median = { url: median.url, text: '', file };
  }
  return { ...page, plots, exports: { ...page.exports, median } };
}
