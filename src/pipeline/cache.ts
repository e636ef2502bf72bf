/**
 * The build cache: a part's page model kept between builds, valid only while
 * every input it was computed from is unchanged byte for byte.
 *
 * An entry is named by the part's slug and a key that hashes what is known
 * before the part is read: the build of scatterbook itself (every file of its
 * compiled code and templates), the site settings, the content folder's
 * template overrides and the part file's text. The entry lists the SHA-256 of
 * every measurement file the part read; on lookup each is hashed again and any
 * difference (an edit in place with the same size and time included) misses.
 * Nothing is parsed to check an entry. A page's plots' SVG and its median
 * text sit in files beside its entry, and the page read back refers to them
 * (pipeline/spill.ts), so a lookup reads a few kilobytes, not the plots.
 */
import { createHash } from 'node:crypto';
import { existsSync, readdirSync, readFileSync, statSync } from 'node:fs';
import { dirname, join, relative, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import { writeFileAtomic } from '../io/atomic.js';
import { spillPage } from './spill.js';
import type { PartPage } from '../model/catalog.js';

const sha256 = (data: string | Uint8Array) => createHash('sha256').update(data).digest('hex');

/** Every file below `dir` whose name passes `keep`, in a stable order, hashed with its path. */
function treeHash(dir: string, keep: (name: string) => boolean = () => true): string {
  const h = createHash('sha256');
  const walk = (d: string) => {
    let names: string[];
    try {
      names = readdirSync(d).sort();
    } catch {
      return;
    }
    for (const name of names) {
      const p = join(d, name);
      let st;
      try {
        st = statSync(p);
      } catch {
        continue;
      }
      if (st.isDirectory()) walk(p);
      else if (st.isFile() && keep(name))
        h.update(`${relative(dir, p)}\0`)
          .update(readFileSync(p))
          .update('\0');
    }
  };
  walk(dir);
  return h.digest('hex');
}

let toolHash: string | null = null;

/**
 * The build of scatterbook that runs: its compiled code (this module's tree,
 * dist/ or src/), its templates and styles, and package.json. Two builds with
 * the same version number but different code get different keys.
 */
export function toolBuildId(): string {
  if (toolHash) return toolHash;
  const code = resolve(dirname(fileURLToPath(import.meta.url)), '..');
  const root = resolve(code, '..');
  const h = createHash('sha256');
  h.update(treeHash(code, (n) => /\.(js|ts|mjs|njk|css)$/.test(n) && !n.endsWith('.d.ts')));
  h.update(treeHash(join(root, 'src/site')));
  h.update(readFileSync(join(root, 'package.json')));
  toolHash = h.digest('hex');
  return toolHash;
}

export interface PartCache {
  /** What keys every entry besides the part's own files: the tool's build, site.yaml, the template overrides. */
  readonly base: string;
  /** The cached page of a part, or null when there is none or any input changed. */
  read(slug: string, partFile: string): PartPage | null;
  write(slug: string, partFile: string, page: PartPage): void;
}

/** A cache in `dir` for one build: `siteText` is site.yaml's text, `content` the content folder (its _includes/ key the entries too). */
export function openCache(dir: string, content: string, siteText: string): PartCache {
  const base = createHash('sha256')
    .update(toolBuildId())
    .update('\0')
    .update(siteText)
    .update('\0')
    .update(treeHash(join(content, '_includes')))
    .digest('hex');
  const keyOf = (partFile: string): string | null => {
    try {
      // release records and released documents key the entry too: they make the revision history and the release check
      const dir = dirname(partFile);
      const records = readdirSync(dir)
        .filter((n) => /^release-.+\.txt$/.test(n))
        .sort()
        .map((n) => `${n}\0${readFileSync(join(dir, n), 'utf8')}`)
        .join('\0');
      return sha256(`${base}\0${readFileSync(partFile, 'utf8')}\0${records}\0${treeHash(join(dir, 'released'))}`).slice(0, 32);
    } catch {
      return null; // not a readable file: the part's build says why
    }
  };
  const entryPath = (slug: string, key: string) => join(dir, `${slug}-${key}.json`);
  return {
    base,
    read(slug, partFile) {
      const key = keyOf(partFile);
      if (!key) return null;
      let entry: { inputs: Record<string, string>; page: PartPage };
      try {
        entry = JSON.parse(readFileSync(entryPath(slug, key), 'utf8')) as typeof entry;
      } catch {
        return null;
      }
      for (const [file, hash] of Object.entries(entry.inputs ?? {})) {
        try {
          if (sha256(readFileSync(resolve(dirname(partFile), file))) !== hash) return null;
        } catch {
          return null;
        }
      }
      const page = entry.page ?? null;
      // the bulky texts stay in the cache's files: the page refers to them (pipeline/spill.ts), if they are all there
      if (page && (page.plots.some((p) => p.svgFile && !existsSync(p.svgFile)) || (page.exports.median?.file && !existsSync(page.exports.median.file))))
        return null;
      return page;
    },
    write(slug, partFile, page) {
      const key = keyOf(partFile);
      if (!key) return;
      const inputs = Object.fromEntries(page.measurements.map((m) => [m.file, m.sha256]));
      // SVGs and the median text in files of their own beside the entry, so that reading an entry reads little
      writeFileAtomic(entryPath(slug, key), JSON.stringify({ inputs, page: spillPage(page, dir, `${slug}-${key}`, writeFileAtomic, true) }));
    },
  };
}
