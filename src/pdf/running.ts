/**
 * The running header and footer of every PDF page, drawn into the printed PDF
 * with pdf-lib in the page's own typeface (Inter, regular, from the npm
 * package @fontsource/inter, embedded as a subset through @pdf-lib/fontkit).
 * Chromium's own header and footer templates are rendered apart from the page
 * and cannot load web fonts, so they would fall back to a system face.
 */
import fontkit from '@pdf-lib/fontkit';
import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { dirname, join } from 'node:path';
import { rgb, type PDFDocument } from 'pdf-lib';

export interface RunningText {
  readonly header: { readonly left: string; readonly right: string };
  readonly footer: string;
}

let fontBytes: Uint8Array | null = null;

function interRegular(): Uint8Array {
  if (!fontBytes) {
    const dir = join(dirname(createRequire(import.meta.url).resolve('@fontsource/inter/package.json')), 'files');
    fontBytes = readFileSync(join(dir, 'inter-latin-400-normal.woff'));
  }
  return fontBytes;
}

/** Left/right lines 15 mm from the edges, the header 9 mm from the top, the footer 8 mm from the bottom, 7.5 pt grey. */
export async function drawRunningText(doc: PDFDocument, text: RunningText): Promise<void> {
  doc.registerFontkit(fontkit);
  const font = await doc.embedFont(interRegular(), { subset: true });
  const size = 7.5;
  const color = rgb(0x4a / 255, 0x4f / 255, 0x57 / 255);
  const mm = 72 / 25.4;
  const pages = doc.getPages();
  pages.forEach((page, i) => {
    const { width, height } = page.getSize();
    const right = (s: string, y: number) => page.drawText(s, { x: width - 15 * mm - font.widthOfTextAtSize(s, size), y, size, font, color });
    page.drawText(text.header.left, { x: 15 * mm, y: height - 9 * mm, size, font, color });
    right(text.header.right, height - 9 * mm);
    page.drawText(text.footer, { x: 15 * mm, y: 8 * mm, size, font, color });
    right(`page ${i + 1} of ${pages.length}`, 8 * mm);
  });
}
