/** Which pages become which PDFs, and what each PDF says about itself. */
import { join } from 'node:path';
import type { Catalog } from '../pipeline/catalog.js';
import type { PrintJob } from './print.js';

/** parts/<slug>/<PART-NUMBER>.pdf, the part number kept to letters, digits, '.', '-' and '_'. */
export function pdfFileName(part: string, slug: string): string {
  const safe = part.replace(/[^A-Za-z0-9._-]+/g, '_').replace(/^[._]+/, '');
  return `${safe || slug}.pdf`;
}

export function withPdfLinks(catalog: Catalog): Catalog {
  const parts = catalog.parts.map((p) => ({ ...p, pdfUrl: `parts/${p.slug}/${pdfFileName(p.part, p.slug)}` }));
  return { ...catalog, parts, byClass: catalog.byClass.map((g) => ({ ...g, parts: g.parts.map((p) => parts.find((q) => q.slug === p.slug) ?? p) })) };
}

export function printJobs(catalog: Catalog, root: string, version: string): PrintJob[] {
  return catalog.parts.map((p) => ({
    html: join(root, 'parts', p.slug, 'index.html'),
    pdf: join(root, 'parts', p.slug, pdfFileName(p.part, p.slug)),
    metadata: {
      title: p.title ? `${p.part} — ${p.title}` : p.part,
      subject: `${p.partClass} datasheet, revision ${p.revision || '—'}`,
      author: p.vendor,
      keywords: [p.part, p.partClass, p.vendor],
      date: p.date || null,
      creator: `scatterbook ${version}`,
    },
    header: { left: p.vendor, right: `${p.part} · revision ${p.revision || '—'}${p.date ? ` · ${p.date}` : ''}` },
    footer: `${p.part} datasheet`,
  }));
}
