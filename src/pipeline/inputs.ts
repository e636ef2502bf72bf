/**
 * What a page rests on, for the manifest and the documents' fingerprint: the
 * part file and every measurement file, relative to the content folder, with
 * their SHA-256.
 */
import { createHash } from 'node:crypto';
import { relative, sep } from 'node:path';
import type { LoadedUnit } from './part.js';
import { sha256File } from '../io/hash.js';
import type { Inputs } from '../model/catalog.js';

/** The SHA-256 of "spec path, sha256" then "data path, sha256" per file, one per line, as 12 hex digits. */
export function fingerprintOf(spec: Inputs['spec'], data: Inputs['data']): string {
  const lines = [spec, ...data].map((f) => `${f.path} ${f.sha256}\n`).join('');
  return createHash('sha256').update(lines).digest('hex').slice(0, 12);
}

/** A file's place in the content folder, with / between folders. */
export const contentPath = (contentRoot: string, path: string) => relative(contentRoot, path).split(sep).join('/');

export function inputsOf(specFile: string, units: readonly LoadedUnit[], contentRoot: string): Inputs {
  const spec = { path: contentPath(contentRoot, specFile), sha256: sha256File(specFile) };
  const data = units.map((u) => ({ unit: u.unit, path: contentPath(contentRoot, u.path), sha256: u.sha256 }));
  return { spec, data, fingerprint: fingerprintOf(spec, data) };
}

/** The part folders of a content folder: parts/<slug>/part.yaml, in name order. */
