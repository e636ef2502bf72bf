/** Which pages become which PDFs, and what each PDF says about itself. */
import { join } from 'node:path';
import type { PrintJob } from './print.js';
import type { Catalog } from '../model/catalog.js';

/** The part number kept to letters, digits, '.', '-' and '_' (no leading '.' or '_'), or the slug when nothing is left: how the part's files in the site are named. */
export function partFileStem(part: string, slug: string): string {
  return part.replace(/[^A-Za-z0-9._-]+/g, '_').replace(/^[._]+/, '') || slug;
}

/** parts/<slug>/<PART-NUMBER>.pdf */
export const pdfFileName = (part: string, slug: string) => `${partFileStem(part, slug)}.pdf`;

/** parts/<slug>/<PART-NUMBER>-report.pdf */
export const reportPdfFileName = (part: string, slug: string) => pdfFileName(part, slug).replace(/\.pdf$/, '-report.pdf');

export function withPdfLinks(catalog: Catalog): Catalog {
  const parts = catalog.parts.map((p) => ({
    ...p,
    pdfUrl: `parts/${p.slug}/${pdfFileName(p.part, p.slug)}`,
    reportPdfUrl: p.reportUrl ? `parts/${p.slug}/${reportPdfFileName(p.part, p.slug)}` : null,
  }));
  const find = (p: Catalog['parts'][number]) => parts.find((q) => q.slug === p.slug) ?? p;
  const comparisons = catalog.comparisons.map((c) => ({ ...c, pdfUrl: `comparisons/${c.slug}/${comparisonPdfFileName(c.slug)}` }));
  const findComparison = (c: Catalog['comparisons'][number]) => comparisons.find((x) => x.slug === c.slug) ?? c;
  return {
    ...catalog,
    parts,
    comparisons,
    reportParts: catalog.reportParts.map(find),
    byClass: catalog.byClass.map((g) => ({ ...g, parts: g.parts.map(find) })),
    pages: { parts: catalog.pages.parts.map(find), reports: catalog.pages.reports.map(find), comparisons: catalog.pages.comparisons.map(findComparison) },
  };
}

/** comparisons/<slug>/<slug>-comparison.pdf */
export const comparisonPdfFileName = (slug: string) => `${slug.replace(/[^A-Za-z0-9._-]+/g, '_')}-comparison.pdf`;

/** The datasheet of every part, then its test report where reports are built; then every comparison. */
export function printJobs(catalog: Catalog, root: string, version: string): PrintJob[] {
  const comparisons = catalog.pages.comparisons.map(
    (c): PrintJob => ({
      html: join(root, 'comparisons', c.slug, 'index.html'),
      pdf: join(root, 'comparisons', c.slug, comparisonPdfFileName(c.slug)),
      metadata: {
        title: `${c.title} (comparison)`,
        subject: `comparison of ${c.candidates.length} candidate parts`,
        author: catalog.site.vendor,
        keywords: ['comparison', ...c.candidates.map((x) => x.label)],
        date: c.date || null,
        creator: `scatterbook ${version}`,
      },
      header: { left: 'Comparison of candidate parts', right: `${c.title}${c.date ? ` · ${c.date}` : ''}` },
      footer: `${c.title} · build ${c.inputs.fingerprint}`,
    }),
  );
  return [...partJobs(catalog, root, version), ...comparisons];
}

function partJobs(catalog: Catalog, root: string, version: string): PrintJob[] {
  return catalog.pages.parts
    .map((p) => catalog.parts.find((q) => q.slug === p.slug) ?? p)
    .flatMap((p) => {
      const metadata = (what: string) => ({
        title: `${p.title ? `${p.part} — ${p.title}` : p.part}${what === 'datasheet' ? '' : ` (${what})`}`,
        subject: `${p.partClass} ${what}, revision ${p.revision || '—'}`,
        author: p.vendor,
        keywords: [p.part, p.partClass, p.vendor, what],
        date: p.date || null,
        creator: `scatterbook ${version}`,
      });
      // the vendor is named once, at the top of page 1; the running header carries the part
      const header = { left: p.title || p.partClass, right: `${p.part} · revision ${p.revision || '—'}${p.date ? ` · ${p.date}` : ''}` };
      const sheet: PrintJob = {
        html: join(root, 'parts', p.slug, 'index.html'),
        pdf: join(root, 'parts', p.slug, pdfFileName(p.part, p.slug)),
        metadata: metadata('datasheet'),
        header,
        footer: `${p.part} datasheet · build ${p.inputs.fingerprint}`,
      };
      if (!p.reportUrl) return [sheet];
      const report: PrintJob = {
        html: join(root, 'parts', p.slug, 'report.html'),
        pdf: join(root, 'parts', p.slug, reportPdfFileName(p.part, p.slug)),
        metadata: metadata('test report'),
        header,
        footer: `${p.part} test report · build ${p.inputs.fingerprint}`,
      };
      return [sheet, report];
    });
}
