/**
 * A part's releases on disk: its release records (release-*.txt beside the
 * part file) and released documents (released/<revision>/), read for the
 * build: the check that a released revision has not changed, the revision
 * history and the released files the site carries unchanged.
 */
import { existsSync, readdirSync, readFileSync, statSync } from 'node:fs';
import { join } from 'node:path';
import type { SpecError } from '../part-file/diagnostics.js';
import { changedSince, figureChanges, parseRecord, recordName, releasedFolder, type RecordedFigure, type RecordedFile, type ReleaseRecord } from './release.js';
import type { HistoryRow } from '../model/catalog.js';

/** Every release record of a part folder, oldest release first. */
export function readReleases(partDir: string, display: (file: string) => string): { records: ReleaseRecord[]; errors: SpecError[] } {
  const records: ReleaseRecord[] = [];
  const errors: SpecError[] = [];
  if (!existsSync(partDir)) return { records, errors };
  for (const name of readdirSync(partDir)
    .filter((n) => /^release-.+\.txt$/.test(n))
    .sort()) {
    const r = parseRecord(readFileSync(join(partDir, name), 'utf8'));
    if ('value' in r) records.push(r.value);
    else
      errors.push({
        code: 'bad-value',
        file: display(join(partDir, name)),
        line: r.line,
        column: r.line ? 1 : 0,
        message: `not a release record: ${r.message}`,
      });
  }
  records.sort((a, b) => (a.released < b.released ? -1 : a.released > b.released ? 1 : 0));
  return { records, errors };
}

/** The error of a build whose released revision changed, positioned at the part file's revision; null when it holds. */
export function releaseProblem(
  records: readonly ReleaseRecord[],
  revision: string,
  spec: RecordedFile,
  data: readonly RecordedFile[],
  at: { file: string; line: number; column: number },
): SpecError | null {
  const record = records.find((r) => r.revision === revision);
  if (!record) return null;
  const changed = changedSince(record, spec, data);
  if (!changed.length) return null;
  return {
    code: 'bad-value',
    ...at,
    message: `revision ${revision} was released on ${record.released.slice(0, 10)} (${recordName(revision)}), and since then ${changed.join(', ')} changed; a released revision never changes: raise revision for the new one`,
  };
}

/** The revision history: every release, then the current revision when it is not released yet. */
export function history(
  records: readonly ReleaseRecord[],
  current: { revision: string; date: string; figures: readonly RecordedFigure[] },
  slug: string,
  partDir: string,
): { rows: HistoryRow[]; files: Array<{ from: string; url: string }> } {
  const rows: HistoryRow[] = [];
  const files: Array<{ from: string; url: string }> = [];
  let before: readonly RecordedFigure[] | null = null;
  for (const r of records) {
    const folder = releasedFolder(r.revision);
    const documents = r.documents
      .filter((d) => d.path.endsWith('.pdf') && existsSync(join(partDir, d.path)) && statSync(join(partDir, d.path)).isFile())
      .map((d) => {
        const url = `parts/${slug}/${d.path}`;
        files.push({ from: join(partDir, d.path), url });
        return { name: d.path.slice(folder.length + 1), url };
      });
    rows.push({
      revision: r.revision,
      date: r.date,
      released: r.released.slice(0, 10),
      current: r.revision === current.revision,
      changes: before ? figureChanges(before, r.figures) : ['first release'],
      documents,
    });
    before = r.figures;
  }
  if (!records.some((r) => r.revision === current.revision)) {
    rows.push({
      revision: current.revision || '—',
      date: current.date,
      released: '',
      current: true,
      changes: before ? figureChanges(before, current.figures) : [],
      documents: [],
    });
  }
  return { rows, files };
}
