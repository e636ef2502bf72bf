/**
 * The whole content folder → Catalog, with an optional cache of part pages by
 * the hash of their inputs, and a progress callback.
 */
import { createHash } from 'node:crypto';
import { mkdirSync, readFileSync, statSync } from 'node:fs';
import { dirname, join, resolve } from 'node:path';
import { writeFileAtomic } from '../io/atomic.js';
import { assembleCatalog, buildPartPage, partFolders, readSettings, type Catalog, type PartFailure, type PartPage } from './catalog.js';

export interface BuildCatalogOptions {
  readonly cacheDir?: string | null;
  readonly version: string;
  readonly onPart?: (done: number, total: number, slug: string) => void;
}

export interface CatalogBuild {
  readonly catalog: Catalog;
  readonly settingsErrors: readonly string[];
  readonly cacheHits: number;
}

/**
 * A part page depends on its YAML, its measurement files, the site settings
 * and the scatterbook version; the key hashes the YAML text and each data
 * file's path, size and modification time.
 */
function cacheKey(partFile: string, settingsText: string, version: string): string {
  const h = createHash('sha256');
  const yaml = readFileSync(partFile, 'utf8');
  h.update(version).update('\0').update(settingsText).update('\0').update(yaml);
  for (const m of yaml.matchAll(/file:\s*["']?([^,}\s"']+)/g)) {
    try {
      const st = statSync(resolve(dirname(partFile), m[1]));
      h.update(`\0${m[1]}:${st.size}:${st.mtimeMs}`);
    } catch {
      h.update(`\0${m[1]}:missing`);
    }
  }
  return h.digest('hex').slice(0, 32);
}

export async function buildCatalog(contentRoot: string, options: BuildCatalogOptions): Promise<CatalogBuild> {
  const { settings, errors } = readSettings(contentRoot);
  const folders = partFolders(contentRoot);
  const pages: PartPage[] = [];
  const failures: PartFailure[] = [];
  let hits = 0;
  let settingsText = '';
  try {
    settingsText = readFileSync(join(contentRoot, 'site.yaml'), 'utf8');
  } catch {
    settingsText = '';
  }
  let done = 0;
  for (const { slug, file } of folders) {
    const key = options.cacheDir ? cacheKey(file, settingsText, options.version) : null;
    const cached = key && options.cacheDir ? readCache(join(options.cacheDir, `${slug}-${key}.json`)) : null;
    if (cached) {
      pages.push(cached);
      hits++;
    } else {
      const b = await buildPartPage(file, contentRoot, slug, settings);
      if (b.page) {
        pages.push(b.page);
        if (key && options.cacheDir) {
          mkdirSync(options.cacheDir, { recursive: true });
          writeFileAtomic(join(options.cacheDir, `${slug}-${key}.json`), JSON.stringify(b.page));
        }
      }
      if (b.failure) failures.push(b.failure);
    }
    options.onPart?.(++done, folders.length, slug);
  }
  return { catalog: assembleCatalog(settings, pages, failures, options.version), settingsErrors: errors, cacheHits: hits };
}

function readCache(path: string): PartPage | null {
  try {
    return JSON.parse(readFileSync(path, 'utf8')) as PartPage;
  } catch {
    return null;
  }
}
