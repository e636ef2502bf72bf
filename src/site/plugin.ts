/**
 * The Eleventy plugin: the only place that knows Eleventy. It hands the
 * catalog (computed in TypeScript first) to the templates as global data,
 * sets up Nunjucks with autoescaping and a template search path in which the
 * content folder's `_includes/` comes before ours (so a vendor overrides a
 * template by writing one of the same name), and copies the assets.
 */
import { existsSync } from 'node:fs';
import { createRequire } from 'node:module';
import { dirname, join, relative, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import type { UserConfig } from '@11ty/eleventy';
import nunjucks from 'nunjucks';
import { svgOf } from '../io/spilled.js';
import { copyAssets, planAssets } from '../io/assets.js';
import type { Catalog, PartPage } from '../model/catalog.js';

/** The package root (this file is src/site/plugin.ts, or dist/site/plugin.js once compiled). */
export const PACKAGE_ROOT = resolve(dirname(fileURLToPath(import.meta.url)), '../..');
export const PAGES_DIR = join(PACKAGE_ROOT, 'src/site/pages');
export const INCLUDES_DIR = join(PACKAGE_ROOT, 'src/site/_includes');
const ASSETS_DIR = join(PACKAGE_ROOT, 'src/site/assets');

/** The typeface travels with the project (the npm package @fontsource/inter, SIL Open Font License), so pages and PDFs look alike everywhere. */
export const FONT_WEIGHTS = [400, 600, 700] as const;

/** Latin, and Greek for Γ, μ, Ω and the like (the stylesheet selects each by its unicode-range). */
export const FONT_SUBSETS = ['latin', 'greek'] as const;

export function fontFiles(): Array<{ from: string; to: string }> {
  const dir = join(dirname(createRequire(import.meta.url).resolve('@fontsource/inter/package.json')), 'files');
  return FONT_SUBSETS.flatMap((subset) =>
    FONT_WEIGHTS.map((w) => ({ from: join(dir, `inter-${subset}-${w}-normal.woff2`), to: `assets/fonts/inter-${subset}-${w}-normal.woff2` })),
  );
}

export interface SitePluginOptions {
  /** The content folder (parts/, site.yaml, _includes/, assets/). */
  readonly content: string;
  /** The catalog, or how to make it (a plain Eleventy run computes it here). */
  readonly catalog: Catalog | (() => Promise<Catalog>);
}

const UNIT_AFTER_NUMBER = /(\d) (?=(?:dBm|dBc|dB|GHz|MHz|kHz|Hz|ns|ps|µs|us|ms|°C|°|Ω|mW|W|mA|A|mV|V|mm|g)(?![A-Za-z]))/g;

/** HTML with a no-break space between each number and the unit after it, in text only: never inside a tag (attributes keep their values) or a script. */
export function noBreakUnits(html: string): string {
  return html.replace(/(<script\b[\s\S]*?<\/script>)|(<[^>]*>)|([^<]+)/g, (all, script, tag, text) =>
    text ? text.replace(UNIT_AFTER_NUMBER, '$1\u00a0') : all,
  );
}

/** Copies the files the parts' pages link into the site: their measured Touchstone files and released documents. */
export function copyLinkedFiles(content: string, parts: readonly PartPage[], out: string): void {
  const files = parts.flatMap((p) => [...p.dataFiles, ...p.releasedFiles].map((d) => ({ from: join(content, d.from), to: d.url })));
  copyAssets({ files, errors: [] }, out);
}

export function templateSearchPath(content: string): string[] {
  const own = join(content, '_includes');
  return existsSync(own) ? [own, INCLUDES_DIR] : [INCLUDES_DIR];
}

/** One Nunjucks environment per Eleventy run (per build, and per rebuild of `serve`): templates compile once a build, and a template edited between builds is read again. */
export function scatterbookSite(config: UserConfig, options: SitePluginOptions): void {
  const env = new nunjucks.Environment(new nunjucks.FileSystemLoader(templateSearchPath(options.content), { noCache: false }), {
    autoescape: true,
    throwOnUndefined: false,
    trimBlocks: true,
    lstripBlocks: true,
  });
  // a plot's SVG comes from the page model or, in a build, from the file it waits in (pipeline/spill.ts)
  env.addFilter('plotSvg', svgOf);
  config.setLibrary('njk', env);
  let resolved: Promise<Catalog> | null = null;
  const catalog = () => (resolved ??= typeof options.catalog === 'function' ? options.catalog() : Promise.resolve(options.catalog));
  config.addGlobalData('catalog', catalog);
  // a number and its unit never part at a line end: "2.45 GHz", "1.2 dB", "25 °C", "50 Ω" get a no-break space
  config.addTransform('number-unit-no-break', (content: string, outputPath: string) =>
    typeof outputPath === 'string' && outputPath.endsWith('.html') ? noBreakUnits(content) : content,
  );
  config.addPassthroughCopy({ [ASSETS_DIR]: 'assets' });
  for (const f of fontFiles()) config.addPassthroughCopy({ [f.from]: f.to });
  // the vendor's assets: regular files only, never a link out of the content folder (see io/assets.ts)
  config.on('eleventy.after', async (...args: unknown[]) => {
    const { directories } = args[0] as { directories: { output: string } };
    const out = resolve(directories.output);
    const plan = planAssets(options.content);
    if (plan.errors.length) throw new Error(plan.errors.join('\n'));
    copyAssets(plan, out);
    // the measured Touchstone files the datasheets link ("S-parameter data"), unless site.yaml keeps them out
    copyLinkedFiles(options.content, (await catalog()).pages.parts, out);
  });
  // Eleventy reads watch targets relative to the working folder
  config.addWatchTarget(relative(process.cwd(), options.content) || '.');
}
