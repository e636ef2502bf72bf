/**
 * The whole content folder → Catalog, with an optional cache of part pages by
 * the hash of their inputs, and a progress callback.
 */
import { createHash } from 'node:crypto';
import { mkdirSync, readFileSync, statSync } from 'node:fs';
import { dirname, join, resolve } from 'node:path';
import { parse } from 'yaml';
import { writeFileAtomic } from '../io/atomic.js';
import { assembleCatalog, buildPartPage, partFolders, readSettings, type Catalog, type PartFailure, type PartPage } from './catalog.js';
import type { StageTimes } from './part.js';

export interface BuildCatalogOptions {
  readonly cacheDir?: string | null;
  readonly version: string;
  readonly onPart?: (done: number, total: number, slug: string) => void;
  readonly times?: StageTimes;
}

export interface CatalogBuild {
  readonly catalog: Catalog;
  readonly settingsErrors: readonly string[];
  readonly cacheHits: number;
}

/** The measurement file paths a part file names (read as YAML; an unreadable file names none). */
function measurementFiles(yaml: string): string[] {
  try {
    const doc = parse(yaml, { version: '1.2' }) as { measurements?: Array<{ file?: unknown }> } | null;
    return (doc?.measurements ?? []).map((m) => m?.file).filter((f): f is string => typeof f === 'string');
  } catch {
    return [];
  }
}

/**
 * A part page depends on its YAML, its measurement files, the site settings
 * and the scatterbook version; the key hashes the YAML text and each data
 * file's path, size and modification time. (A part with errors is never
 * cached, so its errors are reported at every build.)
 */
function cacheKey(partFile: string, settingsText: string, version: string): string | null {
  const h = createHash('sha256');
  let yaml: string;
  try {
    yaml = readFileSync(partFile, 'utf8');
  } catch {
    return null; // not a readable file: the part's build says why
  }
  h.update(version).update('\0').update(settingsText).update('\0').update(yaml);
  for (const file of measurementFiles(yaml)) {
    try {
      const st = statSync(resolve(dirname(partFile), file));
      h.update(`\0${file}:${st.size}:${st.mtimeMs}`);
    } catch {
      h.update(`\0${file}:missing`);
    }
  }
  return h.digest('hex').slice(0, 32);
}

export async function buildCatalog(contentRoot: string, options: BuildCatalogOptions): Promise<CatalogBuild> {
  const { settings, errors, text: settingsText } = readSettings(contentRoot);
  const folders = partFolders(contentRoot);
  const pages: PartPage[] = [];
  const failures: PartFailure[] = [];
  let hits = 0;
  // parts build a few at a time, so that plots drawn in worker threads overlap the next part's figures;
  // results keep the folders' order
  const results: Array<{ page: PartPage | null; failure: PartFailure | null }> = new Array(folders.length);
  let done = 0;
  let nextIndex = 0;
  const worker = async () => {
    while (nextIndex < folders.length) {
      const i = nextIndex++;
      const { slug, file } = folders[i];
      const key = options.cacheDir ? cacheKey(file, settingsText, options.version) : null;
      const cached = key && options.cacheDir ? readCache(join(options.cacheDir, `${slug}-${key}.json`)) : null;
      if (cached) {
        results[i] = { page: cached, failure: null };
        hits++;
      } else {
        const b = await buildPartPage(file, contentRoot, slug, settings, options.times);
        if (b.page && key && options.cacheDir) {
          mkdirSync(options.cacheDir, { recursive: true });
          writeFileAtomic(join(options.cacheDir, `${slug}-${key}.json`), JSON.stringify(b.page));
        }
        results[i] = b;
      }
      done++;
      options.onPart?.(done, folders.length, slug);
    }
  };
  await Promise.all(Array.from({ length: 3 }, worker));
  for (const r of results) {
    if (r.page) pages.push(r.page);
    if (r.failure) failures.push(r.failure);
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
