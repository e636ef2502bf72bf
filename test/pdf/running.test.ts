/**
 * The running header and footer are drawn in the page's typeface: on a blank
 * A4 page, the only font poppler finds is the embedded Inter, and the text
 * reads back with pdftotext (so it carries a ToUnicode map).
 */
import { execFileSync, spawnSync } from 'node:child_process';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { PDFDocument } from 'pdf-lib';
import { describe, expect, it } from 'vitest';
import { drawRunningText } from '../../src/pdf/running.js';

const havePoppler = spawnSync('pdfinfo', ['-v']).status === 0;
if (!havePoppler && process.env.CI) throw new Error('PDF tests need poppler-utils in CI: apt-get install -y poppler-utils');

describe.skipIf(!havePoppler)('the running header and footer', () => {
  it('are Inter, embedded, and read back as text on every page', async () => {
    const doc = await PDFDocument.create();
    doc.addPage([595.28, 841.89]);
    doc.addPage([595.28, 841.89]);
    await drawRunningText(doc, { header: { left: 'Bandpass filter, 2.40–2.50 GHz', right: 'XQ-1 · revision B' }, footer: 'XQ-1 datasheet' });
    const file = join(mkdtempSync(join(tmpdir(), 'scatterbook-running-')), 'r.pdf');
    writeFileSync(file, await doc.save());
    const fonts = execFileSync('pdffonts', [file], { encoding: 'utf8' }).split('\n').slice(2).filter(Boolean);
    expect(fonts.length).toBe(1);
    expect(fonts[0]).toMatch(/^Inter-Regular\S*\s+CID TrueType\s+Identity-H\s+yes/);
    for (const p of [1, 2]) {
      const text = execFileSync('pdftotext', ['-f', String(p), '-l', String(p), '-layout', file, '-'], { encoding: 'utf8' });
      expect(text).toContain('Bandpass filter, 2.40–2.50 GHz');
      expect(text).toContain('XQ-1 · revision B');
      expect(text).toContain(`page ${p} of 2`);
    }
  });
});
