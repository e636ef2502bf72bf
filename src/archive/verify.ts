/**
 * `scatterbook verify`: a built site against its manifest. Every output file
 * is hashed again; given the content folder, every input file too, and every
 * part's figures are computed again and compared with the published ones
 * (exactly: the same inputs and the same tool give the same numbers).
 */
import { existsSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { figuresJson } from '../evaluate/json.js';
import { evaluatePartFile } from '../pipeline/part.js';
import { sha256File } from '../io/hash.js';
import { MANIFEST, siteFiles, type Manifest, type ManifestFile } from './manifest.js';

export interface VerifyReport {
  /** What differs, one line each: the file or figure, and the old and new value. */
  readonly differences: readonly string[];
  readonly outputs: number;
  readonly inputs: number;
  readonly figures: number;
  /** Why nothing could be checked (no manifest, a manifest that is not one), or null. */
  readonly unreadable: string | null;
}

type Result = {
  figure: string;
  on: string[];
  band: string;
  worst: unknown;
  worstAtHz: unknown;
  typical: unknown;
  margin: unknown;
  pass: unknown;
  units: Array<{ unit: string; worst: unknown; margin: unknown; pass: unknown }>;
};

export async function verifySite(siteDir: string, contentDir: string | null): Promise<VerifyReport> {
  const file = join(siteDir, MANIFEST);
  if (!existsSync(file))
    return {
      differences: [],
      outputs: 0,
      inputs: 0,
      figures: 0,
      unreadable: `${MANIFEST} is missing: this is not a site scatterbook built (or it was built before manifests)`,
    };
  let m: Manifest;
  try {
    m = JSON.parse(readFileSync(file, 'utf8')) as Manifest;
    if (!Array.isArray(m.outputs) || !Array.isArray(m.parts)) throw new Error('no outputs or parts');
  } catch (e) {
    return { differences: [], outputs: 0, inputs: 0, figures: 0, unreadable: `${MANIFEST} cannot be read as a manifest: ${(e as Error).message}` };
  }
  const differences: string[] = [];
  const listed = new Set(m.outputs.map((o) => o.path));
  for (const o of m.outputs) {
    const path = join(siteDir, o.path);
    if (!existsSync(path)) differences.push(`${o.path}: missing from the site`);
    else {
      const now = sha256File(path);
      if (now !== o.sha256) differences.push(`${o.path}: changed (SHA-256 ${o.sha256} in the manifest, ${now} now)`);
    }
  }
  for (const path of siteFiles(siteDir)) if (!listed.has(path)) differences.push(`${path}: in the site but not in the manifest`);
  let inputs = 0,
    figures = 0;
  if (contentDir) {
    const check = (f: ManifestFile) => {
      inputs++;
      const path = join(contentDir, f.path);
      if (!existsSync(path)) return differences.push(`${f.path}: input missing from the content folder`);
      const now = sha256File(path);
      if (now !== f.sha256) differences.push(`${f.path}: input changed (SHA-256 ${f.sha256} in the manifest, ${now} now)`);
    };
    for (const e of [...m.parts, ...(m.comparisons ?? [])]) {
      check(e.spec);
      for (const d of e.data) check(d);
    }
    for (const p of m.parts) {
      const specPath = join(contentDir, p.spec.path);
      if (!existsSync(specPath)) continue;
      const outcome = await evaluatePartFile(specPath, contentDir, p.spec.path);
      if (!outcome.result) {
        differences.push(`${p.spec.path}: its figures cannot be computed again: ${outcome.errors[0]?.message ?? 'unknown error'}`);
        continue;
      }
      const before = (p.figures as { results: Result[] }).results;
      const now = (figuresJson(outcome.result) as { results: Result[] }).results;
      if (before.length !== now.length) differences.push(`${p.spec.path}: ${before.length} figures published, ${now.length} now`);
      before.forEach((b, i) => {
        const n = now[i];
        if (!n) return;
        figures++;
        const name = `${p.spec.path}: ${b.figure} ${b.on.join(' ')} over ${b.band}`;
        for (const k of ['worst', 'worstAtHz', 'typical', 'margin', 'pass'] as const)
          if (b[k] !== n[k]) differences.push(`${name}: ${k} ${String(b[k])} published, ${String(n[k])} now`);
        b.units.forEach((u, j) => {
          const nu = n.units[j];
          if (!nu || nu.unit !== u.unit) return differences.push(`${name}: unit ${u.unit} published, ${nu?.unit ?? 'none'} now`);
          for (const k of ['worst', 'margin', 'pass'] as const)
            if (u[k] !== nu[k]) differences.push(`${name}: unit ${u.unit} ${k} ${String(u[k])} published, ${String(nu[k])} now`);
        });
      });
    }
  }
  return { differences, outputs: m.outputs.length, inputs, figures, unreadable: null };
}
