/**
 * Page counts of the demo catalog's PDFs: builds the demo with PDFs into a
 * temporary folder and prints, per part, the pages of its datasheet and its
 * test report (poppler's pdfinfo), with the datasheet budget of the README
 * (2 pages, 3 for the largest part). `npm run bench:pages`.
 */
import { execFileSync, spawnSync } from 'node:child_process';
import { mkdtempSync, readdirSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';

const ROOT = join(import.meta.dirname, '../..');
const out = join(mkdtempSync(join(tmpdir(), 'scatterbook-pages-')), 'site');
const t0 = performance.now();
const r = spawnSync(process.execPath, [join(ROOT, 'bin/scatterbook.js'), 'build', join(ROOT, 'content'), '--out', out, '--no-cache', '--pdf'], {
  encoding: 'utf8',
});
if (r.status !== 0) {
  process.stderr.write(r.stderr);
  process.exit(1);
}
const pages = (pdf: string) => Number(/Pages:\s+(\d+)/.exec(execFileSync('pdfinfo', [pdf], { encoding: 'utf8' }))?.[1]);
process.stdout.write(
  `demo build with PDFs: ${((performance.now() - t0) / 1000).toFixed(1)} s\n\n${'part'.padEnd(16)}${'datasheet'.padStart(10)}${'report'.padStart(8)}\n`,
);
for (const slug of readdirSync(join(out, 'parts')).sort()) {
  const dir = join(out, 'parts', slug);
  const files = readdirSync(dir).filter((f) => f.endsWith('.pdf'));
  const sheet = files.find((f) => !f.endsWith('-report.pdf'));
  const report = files.find((f) => f.endsWith('-report.pdf'));
  process.stdout.write(
    `${slug.padEnd(16)}${String(sheet ? pages(join(dir, sheet)) : '—').padStart(10)}${String(report ? pages(join(dir, report)) : '—').padStart(8)}\n`,
  );
}
process.stdout.write('\nbudget (README): datasheets at most 2 pages, the largest demo part (vt-amp-0560) at most 3\n');
