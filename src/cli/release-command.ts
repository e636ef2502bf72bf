/**
 * `scatterbook release PART.yaml [--browser PATH]`: freezes the part's current
 * revision. Its datasheet and test report (HTML and PDF, built as a build
 * makes them) go to content/parts/<slug>/released/<revision>/, staged and
 * renamed into place; then the release record release-<revision>.txt is
 * written atomically beside the part file (the commit point: a released/
 * folder without its record was never released, and a later release may
 * replace it). A revision already released is refused; nothing released is
 * ever overwritten or deleted.
 */
import { copyFileSync, existsSync, mkdirSync, mkdtempSync, renameSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { basename, dirname, join, relative, resolve } from 'node:path';
import { recordedFigures, recordName, recordText, releasedFolder } from '../archive/release.js';
import { readReleases } from '../archive/releases.js';
import { printable } from '../format/escape.js';
import { writeFileAtomic } from '../io/atomic.js';
import { sha256File } from '../io/hash.js';
import { evaluatePartFile } from '../pipeline/part.js';
import { fingerprintOf } from '../pipeline/inputs.js';
import { pdfFileName, reportPdfFileName } from '../pdf/jobs.js';
import { formatSpecError } from '../part-file/diagnostics.js';
import { packageVersion, runBuild } from './build-command.js';
import { parseArgs, UsageError, type FlagSpec } from './args.js';
import { EXIT, type Command } from './command.js';
import { painter, type Terminal } from './terminal.js';

const FLAGS: FlagSpec[] = [{ name: 'browser', value: true, help: 'the Chromium-family browser that prints the released PDFs (or set SCATTERBOOK_BROWSER)' }];

export const releaseCommand: Command = {
  name: 'release',
  usage: 'scatterbook release PART.yaml [--browser PATH]',
  flags: FLAGS,
  async run(argv, t: Terminal) {
    const args = parseArgs(argv, FLAGS);
    if (args.positionals.length !== 1) throw new UsageError('release takes exactly one part file');
    const shown = args.positionals[0];
    const partFile = resolve(t.cwd, shown);
    const p = painter(t.stderr, t.env);
    const fail = (message: string) => {
      t.stderr.write(`${p.red('error:')} ${printable(message)}\n`);
      return EXIT.badInput;
    };
    const partDir = dirname(partFile),
      slug = basename(partDir);
    if (basename(partFile) !== 'part.yaml' || basename(dirname(partDir)) !== 'parts')
      return fail(`${shown}: a release is of a catalog part, content/parts/<slug>/part.yaml`);
    const contentRoot = dirname(dirname(partDir));
    const outcome = await evaluatePartFile(partFile, contentRoot, shown);
    if (!outcome.part || !outcome.result) {
      for (const e of outcome.errors) t.stderr.write(`${formatSpecError(e, e.file === shown ? outcome.source : undefined)}\n`);
      return EXIT.badInput;
    }
    const part = outcome.part;
    if (!part.revision) return fail(`${shown}: the part has no revision; a release freezes a revision: set revision: first`);
    const { records, errors } = readReleases(partDir, (f) => relative(t.cwd, f) || f);
    if (errors.length) {
      for (const e of errors) t.stderr.write(`${formatSpecError(e)}\n`);
      return EXIT.badInput;
    }
    const recordPath = join(partDir, recordName(part.revision));
    if (records.some((r) => r.revision === part.revision) || existsSync(recordPath))
      return fail(
        `${part.part} revision ${part.revision} is already released (${relative(t.cwd, recordPath)}); a released revision never changes: raise revision: for a new release`,
      );

    // the documents, built exactly as a build makes them (PDFs required)
    const tmp = mkdtempSync(join(tmpdir(), 'scatterbook-release-'));
    try {
      const quiet: Terminal = {
        stdout: { write: () => true, isTTY: false } as never,
        stderr: { write: () => true, isTTY: false } as never,
        env: t.env,
        cwd: t.cwd,
      };
      await runBuild(
        {
          content: contentRoot,
          out: join(tmp, 'site'),
          keepGoing: true,
          cacheDir: null,
          pdf: 'required',
          browser: args.flags.get('browser') as string | undefined,
        },
        quiet,
      );
      const built = join(tmp, 'site', 'parts', slug);
      const docs: Array<[string, string]> = [
        [pdfFileName(part.part, slug), pdfFileName(part.part, slug)],
        [reportPdfFileName(part.part, slug), reportPdfFileName(part.part, slug)],
        ['index.html', 'datasheet.html'],
        ['report.html', 'report.html'],
      ].filter(([from]) => from !== 'report.html' || existsSync(join(built, from))) as Array<[string, string]>;
      const missing = docs.filter(([from]) => !existsSync(join(built, from)));
      if (missing.length)
        return fail(
          `the documents of ${part.part} could not be printed (${missing.map(([f]) => f).join(', ')} missing): a release needs its PDFs, so it needs a Chromium-family browser (--browser PATH or SCATTERBOOK_BROWSER)`,
        );
      const folder = releasedFolder(part.revision);
      const target = join(partDir, folder);
      const staging = join(dirname(target), `.${basename(target)}.staging-${process.pid}`);
      mkdirSync(staging, { recursive: true });
      for (const [from, to] of docs) copyFileSync(join(built, from), join(staging, to));
      // a folder without its record was never released: it is replaced
      if (existsSync(target)) rmSync(target, { recursive: true, force: true });
      renameSync(staging, target);
      const spec = { path: 'part.yaml', sha256: sha256File(partFile) };
      const data = outcome.units.map((u) => ({ path: relative(partDir, u.path).split('\\').join('/'), sha256: u.sha256 }));
      const contentSpec = { path: relative(contentRoot, partFile).split('\\').join('/'), sha256: spec.sha256 };
      const contentData = outcome.units.map((u) => ({ unit: u.unit, path: relative(contentRoot, u.path).split('\\').join('/'), sha256: u.sha256 }));
      writeFileAtomic(
        recordPath,
        recordText({
          part: part.part,
          revision: part.revision,
          date: part.date ?? '',
          released: new Date().toISOString(),
          tool: `scatterbook ${packageVersion()}`,
          fingerprint: fingerprintOf(contentSpec, contentData),
          spec,
          data,
          documents: docs.map(([, to]) => ({ path: `${folder}/${to}`, sha256: sha256File(join(target, to)) })),
          figures: recordedFigures(outcome.result.results),
        }),
      );
      t.stdout.write(
        `released ${printable(part.part)} revision ${printable(part.revision)}: ${relative(t.cwd, recordPath)} and ${relative(t.cwd, target)}/ (${docs.length} documents); commit them with the part\n`,
      );
      return EXIT.ok;
    } finally {
      rmSync(tmp, { recursive: true, force: true });
    }
  },
};
