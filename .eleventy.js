// Eleventy configuration for a plain `npx @11ty/eleventy` here: it builds the
// demo catalog (content/, or the folder in SCATTERBOOK_CONTENT) into _site/
// (or SCATTERBOOK_OUT), the same site `scatterbook build` makes. `scatterbook
// build` does not read this file: it hands its own catalog to the plugin
// (src/site/eleventy-run.ts). The plugin is compiled to dist/ by `npm ci` (prepare).
import { readFileSync } from 'node:fs';
import { buildCatalog } from './dist/pipeline/build-catalog.js';
import { PAGES_DIR, scatterbookSite } from './dist/site/plugin.js';

const version = JSON.parse(readFileSync(new URL('./package.json', import.meta.url), 'utf8')).version;

export default function (eleventyConfig) {
  const content = process.env.SCATTERBOOK_CONTENT ?? 'content';
  const cacheDir = process.env.SCATTERBOOK_CACHE ?? null;
  // the catalog is computed at each build (scatterbook serve has its own watcher and builds through scatterbook build's path)
  scatterbookSite(eleventyConfig, { content, catalog: async () => (await buildCatalog(content, { version, cacheDir })).catalog });
  return { dir: { input: PAGES_DIR, output: process.env.SCATTERBOOK_OUT ?? '_site' }, templateFormats: ['njk'] };
}
