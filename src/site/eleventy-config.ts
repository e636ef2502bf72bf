/**
 * The Eleventy configuration file of `scatterbook build` (eleventy-run.ts): the
 * folders and template formats only. The plugin, with the catalog of that run,
 * comes through Eleventy's `config` option, so that nothing passes between runs
 * through module state; a plain `npx @11ty/eleventy` uses .eleventy.js instead.
 */
import { PAGES_DIR } from './plugin.js';

export default function eleventyConfig(): { dir: { input: string }; templateFormats: string[] } {
  return { dir: { input: PAGES_DIR }, templateFormats: ['njk'] };
}
