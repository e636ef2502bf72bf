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
  scatterbookSite(eleventyConfig, {
    content,
    catalog: handed?.catalog ?? (async () => (await buildCatalog(content, { version, cacheDir: null })).catalog),
  });
  // a plain run writes _site/; scatterbook build names its own (temporary) output folder
  return { dir: handed ? { input: PAGES_DIR } : { input: PAGES_DIR, output: '_site' }, templateFormats: ['njk'] };
}
