/**
 * One comparison from disk: its YAML, each candidate's units (a catalog
 * part's measured units, or Touchstone files), checked as builds check them
 * (inside the content folder, regular files, readable), then compared by the
 * pure core (compare/). The only stage that touches files for a comparison.
 */
import { existsSync, readdirSync, statSync } from 'node:fs';
import { basename, dirname, join, resolve } from 'node:path';
import { bandsNoneCover, candidateErrors, compareCandidates, type CandidateResult } from '../compare/compare.js';
import { baselineDifferences, rankReasons, type CandidateDifference } from '../compare/explain.js';
import { readYamlFile } from '../io/text-file.js';
import { loadComparisonText, type CandidateSpec, type NormalizedComparison } from '../part-file/comparison.js';
import type { SpecError, SpecWarning } from '../part-file/diagnostics.js';
import type { NormalizedPart } from '../part-file/normalize.js';
import { contentFile, loadPartFile, readMeasurementFile, type LoadedUnit } from './part.js';

export interface LoadedCandidate {
  readonly spec: CandidateSpec;
  readonly units: readonly LoadedUnit[];
  /** The catalog part it is, when it is one. */
  readonly part: NormalizedPart | null;
  /** Reader warnings of its measurement files. */
  readonly warnings: readonly SpecWarning[];
}

export interface ComparisonOutcome {
  readonly source: string;
  readonly comparison: NormalizedComparison | null;
  readonly candidates: readonly LoadedCandidate[];
  readonly results: readonly CandidateResult[];
  readonly reasons: readonly string[];
  /** Against the baseline, when there is one. */
  readonly differences: readonly CandidateDifference[] | null;
  readonly errors: readonly SpecError[];
}

const failed = (source: string, errors: readonly SpecError[], comparison: NormalizedComparison | null = null): ComparisonOutcome => ({
  source,
  comparison,
  candidates: [],
  results: [],
  reasons: [],
  differences: null,
  errors,
});

/**
 * @param file  the comparison file
 * @param contentRoot  every file it names must stay inside this folder
 * @param display  how messages name the comparison file
 */
export async function evaluateComparisonFile(file: string, contentRoot: string, display = file): Promise<ComparisonOutcome> {
  const read = readYamlFile(file, display, 'the comparison file');
  if (!read.ok) return failed('', [read.error]);
  const source = read.text;
  const loaded = loadComparisonText(source, display);
  if (!loaded.value) return failed(source, loaded.errors);
  const comparison = loaded.value;
  const base = dirname(file);
  const errors: SpecError[] = [];
  const candidates: LoadedCandidate[] = [];
  for (const c of comparison.candidates) {
    if (c.source.kind === 'part') {
      const r = await loadCandidatePart(c, c.source, base, contentRoot, display);
      if ('errors' in r) errors.push(...r.errors);
      else candidates.push(r);
      continue;
    }
    const units: LoadedUnit[] = [];
    const warnings: SpecWarning[] = [];
    const n = c.source.paths.length;
    c.source.paths.forEach((p, i) => {
      const at = (c.source as Extract<CandidateSpec['source'], { kind: 'files' }>).at[i];
      const r = readMeasurementFile(p, base, contentRoot, `file "${p}" of candidate "${c.label}"`, { file: display, ...at });
      if (!r.ok) {
        errors.push(...r.errors);
        return;
      }
      warnings.push(...r.warnings);
      const unit = n === 1 ? c.label : `${c.label} #${i + 1}`;
      units.push({
        unit,
        serial: unit,
        file: p,
        network: r.value.network,
        noise: r.value.noise,
        mixedModeOrder: r.value.info.mixedModeOrder,
        conditions: {},
        fileAt: at,
        data: r.value,
        path: r.path,
        bytes: r.bytes,
        sha256: r.sha256,
      });
    });
    if (c.portMap) {
      const top = Math.max(...c.portMap);
      for (const u of units) {
        if (top > u.network.ports)
          errors.push({
            code: 'port-range',
            file: display,
            ...c.portsAt,
            message: `the port map of "${c.label}" names port ${top} of the file, but ${u.file} has ${u.network.ports} port${u.network.ports === 1 ? '' : 's'}`,
          });
        else if (u.mixedModeOrder)
          errors.push({
            code: 'bad-value',
            file: display,
            ...c.portsAt,
            message: `${u.file} of "${c.label}" is written in mixed-mode order; its ports are modes, which a port map cannot renumber`,
          });
      }
    }
    candidates.push({ spec: c, units, part: null, warnings });
  }
  if (errors.length) return failed(source, errors, comparison);
  // each candidate's reader warnings come first among its warnings, as a part's do
  const results = compareCandidates(
    comparison.requirement,
    candidates.map((c) => ({ label: c.spec.label, units: c.units, portMap: c.spec.portMap, at: c.spec.at })),
    comparison.referenceOhms,
  ).map((r, i) => (candidates[i].warnings.length ? { ...r, warnings: [...candidates[i].warnings, ...r.warnings] } : r));
  const evaluationErrors = candidateErrors(results);
  for (const band of bandsNoneCover(comparison.requirement, results)) {
    evaluationErrors.push({
      code: 'band-outside-data',
      file: display,
      ...band.at,
      message: `no candidate has any data in band ${band.name}; a comparison there would be all extrapolation: measure it, or narrow the band`,
    });
  }
  if (evaluationErrors.length)
    return failed(
      source,
      evaluationErrors.sort((a, b) => a.line - b.line || a.column - b.column),
      comparison,
    );
  return {
    source,
    comparison,
    candidates,
    results,
    reasons: rankReasons(results),
    differences: comparison.baseline ? baselineDifferences(comparison.requirement, results, comparison.baseline) : null,
    errors: [],
  };
}

async function loadCandidatePart(
  c: CandidateSpec,
  src: Extract<CandidateSpec['source'], { kind: 'part' }>,
  base: string,
  contentRoot: string,
  display: string,
): Promise<LoadedCandidate | { errors: SpecError[] }> {
  const at = { file: display, ...src.at };
  const checked = contentFile(src.path, base, contentRoot, `part "${src.path}" of candidate "${c.label}"`, at);
  if (!checked.ok) return { errors: checked.errors };
  const path = checked.path;
  if (!/\.ya?ml$/i.test(path))
    return {
      errors: [
        {
          code: 'bad-value',
          ...at,
          message: `part "${src.path}" of candidate "${c.label}" is no part file (a part file is YAML, e.g. ../parts/vt-bpf-2450/part.yaml); Touchstone files go under files: or file:`,
        },
      ],
    };
  const r = await loadPartFile(path, contentRoot, src.path);
  if (!r.part) {
    const first = r.errors[0];
    return {
      errors: [
        {
          code: 'bad-value',
          ...at,
          message: `part "${src.path}" of candidate "${c.label}" is no valid part file: ${r.errors.length} error${r.errors.length === 1 ? '' : 's'}, the first ${first ? `at line ${first.line}: ${first.message}` : 'unknown'}`,
        },
      ],
    };
  }
  if (r.errors.length) return { errors: [...r.errors] };
  return { spec: c, units: r.units, part: r.part, warnings: r.warnings };
}

/** The comparison files of a content folder: comparisons/<slug>.yaml, in name order. */
export function comparisonFiles(contentRoot: string): Array<{ slug: string; file: string }> {
  const dir = join(contentRoot, 'comparisons');
  if (!existsSync(dir)) return [];
  return readdirSync(dir)
    .filter((name) => /^[A-Za-z0-9][A-Za-z0-9._-]*\.ya?ml$/.test(name))
    .filter((name) => {
      try {
        return statSync(join(dir, name)).isFile();
      } catch {
        return false;
      }
    })
    .sort()
    .map((name) => ({ slug: basename(name).replace(/\.ya?ml$/i, ''), file: join(dir, name) }));
}

/** The content folder a comparison file belongs to: the parent of its comparisons/ folder, else its own folder. */
export function contentRootOf(file: string): string {
  const dir = dirname(resolve(file));
  return basename(dir) === 'comparisons' ? dirname(dir) : dir;
}
