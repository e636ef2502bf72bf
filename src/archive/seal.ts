/**
 * What every site scatterbook writes ends with, in this order, inside its
 * staging folder: the marker that lets a later build replace the folder, the
 * catalog's exports, and last the manifest, which hashes everything before it.
 */
import { writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { SITE_MARKER, SITE_MARKER_TEXT } from '../io/output-folder.js';
import { writeExports } from './exports.js';
import { buildManifest, MANIFEST, manifestText } from './manifest.js';
import type { Catalog } from '../model/catalog.js';

export function sealSite(catalog: Catalog, dir: string, version: string, options: { readonly medians?: boolean } = {}): void {
  writeFileSync(join(dir, SITE_MARKER), SITE_MARKER_TEXT);
  writeExports(catalog, dir, (path, text) => writeFileSync(path, text), options);
  writeFileSync(join(dir, MANIFEST), manifestText(buildManifest(catalog, dir, version)));
}
