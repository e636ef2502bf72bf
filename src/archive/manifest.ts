/**
 * manifest.json: what a built site rests on and what it holds, for QA to
 * check years later (`scatterbook verify`). Written at the site root by every
 * build, after every page and PDF, inside the staging folder (so it is
 * swapped in with them, never alone). Its keys are a contract (README).
 */
import { createHash } from 'node:crypto';
import { readdirSync, readFileSync, lstatSync } from 'node:fs';
import { join } from 'node:path';
import type { Catalog, Inputs } from '../model/catalog.js';

export const MANIFEST = 'manifest.json';
export const MANIFEST_VERSION = 1;

export interface ManifestFile {
  readonly path: string;
  readonly sha256: string;
}

export interface ManifestEntry {
  readonly slug: string;
  readonly fingerprint: string;
  readonly spec: ManifestFile;
  readonly data: ReadonlyArray<ManifestFile & { readonly unit: string }>;
}

export interface Manifest {
  readonly manifestVersion: number;
  readonly tool: { readonly name: 'scatterbook'; readonly version: string };
  readonly parts: ReadonlyArray<ManifestEntry & { readonly part: string; readonly revision: string; readonly pass: boolean; readonly figures: unknown }>;
  readonly comparisons: ReadonlyArray<ManifestEntry & { readonly title: string }>;
  readonly outputs: ReadonlyArray<ManifestFile & { readonly bytes: number }>;
}

const entry = (slug: string, i: Inputs): ManifestEntry => ({
  slug,
  fingerprint: i.fingerprint,
  spec: i.spec,
  data: i.data.map((d) => ({ unit: d.unit, path: d.path, sha256: d.sha256 })),
});

/** Every regular file under `root` but the manifest itself, by path relative to it (with /), in code-point order. */
export function siteFiles(root: string): string[] {
  const out: string[] = [];
  const walk = (dir: string, rel: string) => {
    for (const name of readdirSync(dir)) {
      const path = join(dir, name),
        r = rel ? `${rel}/${name}` : name;
      const st = lstatSync(path);
      if (st.isDirectory()) walk(path, r);
      else if (st.isFile() && r !== MANIFEST) out.push(r);
    }
  };
  walk(root, '');
  return out.sort((a, b) => (a < b ? -1 : a > b ? 1 : 0));
}

/** The manifest of a built site folder and the catalog it was built from. */
export function buildManifest(catalog: Catalog, siteDir: string, version: string): Manifest {
  return {
    manifestVersion: MANIFEST_VERSION,
    tool: { name: 'scatterbook', version },
    parts: catalog.parts.map((p) => ({
      ...entry(p.slug, p.inputs),
      part: p.part,
      revision: p.revision,
      pass: p.pass,
      figures: JSON.parse(p.figuresJson) as unknown,
    })),
    comparisons: catalog.comparisons.map((c) => ({ ...entry(c.slug, c.inputs), title: c.title })),
    outputs: siteFiles(siteDir).map((path) => {
      const bytes = readFileSync(join(siteDir, path));
      return { path, sha256: createHash('sha256').update(bytes).digest('hex'), bytes: bytes.length };
    }),
  };
}

export const manifestText = (m: Manifest) => `${JSON.stringify(m, null, 2)}\n`;
