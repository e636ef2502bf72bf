// Eleventy configuration of scatterbook: it only adds our plugin. A plain
// `npx @11ty/eleventy` here builds the demo catalog (content/, or the folder in
// SCATTERBOOK_CONTENT) into _site/, the same site `scatterbook build` makes;
// `scatterbook build` uses this file too, handing over the catalog it has
// already computed. The plugin is compiled to dist/ by `npm ci` (prepare).
import { readFileSync } from 'node:fs';
import { buildCatalog } from './dist/pipeline/build-catalog.js';
import { handedCatalog, PAGES_DIR, scatterbookSite } from './dist/site/plugin.js';

const version = JSON.parse(readFileSync(new URL('./package.json', import.meta.url), 'utf8')).version;

export default function (eleventyConfig) {
  const handed = handedCatalog();
  if (handed) eleventyConfig.setQuietMode(true); // scatterbook build prints its own summary
  const content = handed?.content ?? process.env.SCATTERBOOK_CONTENT ?? 'content';
  const cacheDir = process.env.SCATTERBOOK_CACHE ?? null;
  scatterbookSite(eleventyConfig, {
    content,
    // without a handed-over catalog (a plain run, or scatterbook serve) it is computed at each build
    catalog: handed?.catalog ?? (async () => (await buildCatalog(content, { version, cacheDir })).catalog),
  });
  // a plain run writes _site/ (or SCATTERBOOK_OUT); scatterbook build names its own (temporary) folder
  const output = process.env.SCATTERBOOK_OUT ?? '_site';
  return { dir: handed ? { input: PAGES_DIR } : { input: PAGES_DIR, output }, templateFormats: ['njk'] };
}
