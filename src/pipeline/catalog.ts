import { existsSync, readdirSync, realpathSync, statSync } from 'node:fs';
import { join, relative } from 'node:path';
import { CLASSES, classOf } from '../classes/registry.js';
import { formatSpecError } from '../part-file/diagnostics.js';
import { assetPathProblem, loadSettings, type SiteSettings } from '../site-file/settings.js';
import { realPath, within } from '../io/output-folder.js';
import { readYamlFile } from '../io/text-file.js';
import { CPK_MIN_UNITS } from '../archive/lot.js';
import type { Catalog, ComparisonPage, PartFailure, PartPage } from '../model/catalog.js';

export function partFolders(contentRoot: string): Array<{ slug: string; file: string }> {
  const dir = join(contentRoot, 'parts');
  if (!existsSync(dir)) return [];
  return readdirSync(dir)
    .filter((name) => {
      if (name.startsWith('.')) return false;
      try {
        return statSync(join(dir, name)).isDirectory() && existsSync(join(dir, name, 'part.yaml'));
      } catch {
        return false; // a broken link
      }
    })
    .sort()
    .map((slug) => ({ slug, file: join(dir, slug, 'part.yaml') }));
}

/** content/site.yaml, parsed and checked (logo and stylesheet must be files of the content folder's assets/); `text` is '' when there is none (it also keys the cache). */
export function readSettings(contentRoot: string): { settings: SiteSettings; errors: string[]; text: string } {
  const file = join(contentRoot, 'site.yaml');
  const shown = relative(process.cwd(), file) || file;
  const read = readYamlFile(file, shown, 'site.yaml');
  if (!read.ok && !read.missing) return { settings: loadSettings(null, shown).value, errors: [formatSpecError(read.error)], text: '' };
  const text = read.ok ? read.text : null;
  const r = loadSettings(text, shown);
  const errors = [...r.errors];
  for (const key of ['logo', 'stylesheet'] as const) {
    const value = r.value[key];
    const problem = value === null ? null : assetPathProblem(key, value, contentFile(contentRoot));
    if (problem) errors.push({ code: 'bad-value', file: shown, message: problem, ...(r.positions.get(key) ?? { line: 0, column: 0 }) });
  }
  return { settings: r.value, errors: errors.map((e) => formatSpecError(e, text ?? undefined)), text: text ?? '' };
}

export function assembleCatalog(
  site: SiteSettings,
  parts: readonly PartPage[],
  failures: readonly PartFailure[],
  version: string,
  comparisons: readonly ComparisonPage[] = [],
): Catalog {
  const present = new Set(parts.map((p) => p.partClass));
  const order = [...site.classOrder, ...CLASSES.filter((c) => !site.classOrder.includes(c))].filter((c) => present.has(c));
  return {
    site,
    parts,
    reportParts: site.reports ? parts : [],
    byClass: order.map((c) => ({ partClass: c, title: classOf(c).title, parts: parts.filter((p) => p.partClass === c) })),
    failures,
    comparisons,
    version,
    generator: `scatterbook ${version}`,
    cpkMinUnits: CPK_MIN_UNITS,
    pages: { parts, reports: site.reports ? parts : [], comparisons },
  };
}

/** Whether a path relative to the content folder names a regular file there ('outside' when a link leads out of it). */
export function contentFile(contentRoot: string): (rel: string) => boolean | 'outside' {
  const content = realPath(contentRoot);
  return (rel) => {
    try {
      if (!within(content, realpathSync(join(contentRoot, rel)))) return 'outside';
      return statSync(join(contentRoot, rel)).isFile();
    } catch {
      return false;
    }
  };
}
