/**
 * One part from disk: its YAML, its measured files, its figures. The only
 * stage that touches files for a part; everything it calls is pure.
 */
import { lstatSync, readlinkSync, statSync } from 'node:fs';
import { realPath, within } from '../io/output-folder.js';
import { notAFile, readYamlFile } from '../io/text-file.js';
import { dirname, isAbsolute, relative, resolve } from 'node:path';
import { evaluatePart, type PartResult, type UnitData } from '../evaluate/evaluate.js';
import { loadExpressionCompiler, type ExpressionCompiler } from '../figures/expression.js';
import { readTouchstoneFile } from '../io/touchstone-file.js';
import type { SpecError, SpecWarning } from '../part-file/diagnostics.js';
import { loadPartText } from '../part-file/load.js';
import type { NormalizedPart } from '../part-file/normalize.js';
import type { TouchstoneData } from '../touchstone/normalize.js';

export interface LoadedUnit extends UnitData {
  readonly serial: string;
  readonly data: TouchstoneData;
  readonly path: string;
  readonly bytes: number;
  readonly sha256: string;
}

export interface PartOutcome {
  /** The part file's text, for messages that quote it. */
  readonly source: string;
  readonly part: NormalizedPart | null;
  readonly units: readonly LoadedUnit[];
  readonly result: PartResult | null;
  readonly errors: readonly SpecError[];
  /** The measurement files' reader warnings (they are also the first of result.warnings). */
  readonly warnings: readonly SpecWarning[];
}

let compiler: Promise<ExpressionCompiler> | null = null;

/** Milliseconds spent per stage, summed over parts (for benchmarks and summaries). */
export interface StageTimes {
  read: number;
  figures: number;
  plots: number;
  pages: number;
}

/** @public used by the build benchmark (test/bench/build.bench.ts, through dist/) */
export const newStageTimes = (): StageTimes => ({ read: 0, figures: 0, plots: 0, pages: 0 });

/** True when `target` lies inside `root` (links resolved as far as each path exists). */
export function isInside(root: string, target: string): boolean {
  return within(realPath(root), realPath(target));
}

/** A file a user's file names, checked as every build checks it: relative, inside the content folder, there, and a regular file. */
export function contentFile(
  file: string,
  base: string,
  contentRoot: string,
  /** How messages name the file, e.g. measurement file "data/sn1.s2p" of unit SN1. */
  what: string,
  where: { readonly file: string; readonly line: number; readonly column: number },
): { ok: true; path: string } | { ok: false; errors: SpecError[] } {
  const path = resolve(base, file);
  const at = { file: where.file, line: where.line, column: where.column };
  if (isAbsolute(file) || !isInside(contentRoot, path)) {
    return {
      ok: false,
      errors: [
        {
          code: 'path-outside',
          ...at,
          message: `${what} lies outside the content folder ${relative(process.cwd(), contentRoot) || '.'}; files must stay inside it`,
        },
      ],
    };
  }
  let problem: string | null;
  try {
    problem = notAFile(statSync(path));
  } catch (e) {
    return {
      ok: false,
      errors: [
        {
          code: 'missing-file',
          ...at,
          message: `${what} ${whyNotThere(path, (e as NodeJS.ErrnoException).code)} (looked for ${relative(process.cwd(), path)})`,
        },
      ],
    };
  }
  if (problem) return { ok: false, errors: [{ code: 'missing-file', ...at, message: `${what} ${problem} (${relative(process.cwd(), path)})` }] };
  return { ok: true, path };
}

/** Why a path that cannot be stat'ed is not there: missing, a link to nothing, a loop of links, or not readable. */
function whyNotThere(path: string, code: string | undefined): string {
  if (code === 'ELOOP') return 'is a symbolic link that leads round in a loop';
  if (code === 'EACCES') return 'cannot be reached (permission denied)';
  try {
    if (lstatSync(path).isSymbolicLink()) return `is a symbolic link to ${readlinkSync(path)}, which does not exist`;
  } catch {
    // not even the link is there
  }
  return 'does not exist';
}

/** A measurement file, checked by contentFile, then read as Touchstone. */
export function readMeasurementFile(
  file: string,
  base: string,
  contentRoot: string,
  /** How messages name the file, e.g. measurement file "data/sn1.s2p" of unit SN1. */
  what: string,
  where: { readonly file: string; readonly line: number; readonly column: number },
):
  | { ok: true; path: string; value: NonNullable<ReturnType<typeof readTouchstoneFile>['value']>; bytes: number; sha256: string; warnings: SpecWarning[] }
  | { ok: false; errors: SpecError[] } {
  const checked = contentFile(file, base, contentRoot, what, where);
  if (!checked.ok) return checked;
  const path = checked.path;
  const r = readTouchstoneFile(path);
  const fileLabel = relative(process.cwd(), path);
  const positioned = (d: { line: number; column?: number; message: string }) => ({
    code: 'touchstone' as const,
    file: fileLabel,
    line: d.line,
    column: d.column ?? (d.line ? 1 : 0),
    message: d.message,
  });
  if (!r.value) return { ok: false, errors: r.errors.map(positioned) };
  return { ok: true, path, value: r.value, bytes: r.bytes, sha256: r.sha256, warnings: r.warnings.map(positioned) };
}

export interface LoadedPartFile {
  readonly source: string;
  readonly part: NormalizedPart | null;
  readonly units: readonly LoadedUnit[];
  readonly errors: readonly SpecError[];
  /** Reader warnings of the measurement files, in the order of the measurements. */
  readonly warnings: readonly SpecWarning[];
}

/**
 * A part file and its measured units, read and checked (not evaluated).
 * @param partFile  the part.yaml path
 * @param contentRoot  measurement files must stay inside this folder (a build's content folder;
 *   the part file's own folder for a standalone `figures`)
 * @param displayName  how messages name the part file
 */
export async function loadPartFile(partFile: string, contentRoot: string, displayName = partFile): Promise<LoadedPartFile> {
  const read = readYamlFile(partFile, displayName);
  if (!read.ok) return { source: '', part: null, units: [], errors: [read.error], warnings: [] };
  const source = read.text;
  let loaded = loadPartText(source, displayName);
  // custom figures need the expression compiler (mathjs), loaded only for the parts that have them
  if (loaded.needsCompiler) loaded = loadPartText(source, displayName, await (compiler ??= loadExpressionCompiler()));
  if (!loaded.value) return { source, part: null, units: [], errors: loaded.errors, warnings: [] };
  const part = loaded.value;
  const base = dirname(partFile);
  const errors: SpecError[] = [];
  const warnings: SpecWarning[] = [];
  const units: LoadedUnit[] = [];
  for (const m of part.measurements) {
    const r = readMeasurementFile(m.file, base, contentRoot, `measurement file "${m.file}" of unit ${m.unit}`, { file: displayName, ...m.fileAt });
    if (!r.ok) {
      errors.push(...r.errors);
      continue;
    }
    warnings.push(...r.warnings);
    units.push({
      unit: m.label,
      serial: m.unit,
      file: m.file,
      network: r.value.network,
      noise: r.value.noise,
      mixedModeOrder: r.value.info.mixedModeOrder,
      conditions: m.conditions,
      fileAt: m.fileAt,
      data: r.value,
      path: r.path,
      bytes: r.bytes,
      sha256: r.sha256,
    });
  }
  return { source, part, units, errors, warnings };
}

/** loadPartFile, then the part's figures. */
export async function evaluatePartFile(partFile: string, contentRoot: string, displayName = partFile, times?: StageTimes): Promise<PartOutcome> {
  const t0 = performance.now();
  const { source, part, units, errors, warnings } = await loadPartFile(partFile, contentRoot, displayName);
  if (!part || errors.length) return { source, part, units, result: null, errors, warnings };
  const t1 = performance.now();
  const evaluated = evaluatePart(part, units);
  if (times) {
    times.read += t1 - t0;
    times.figures += performance.now() - t1;
  }
  // the reader's warnings come first among the result's: figures, the build and both pages show them with the evaluation's
  const result = evaluated.value && warnings.length ? { ...evaluated.value, warnings: [...warnings, ...evaluated.value.warnings] } : evaluated.value;
  return { source, part, units, result, errors: evaluated.errors, warnings };
}
