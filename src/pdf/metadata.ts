/**
 * PDF document information: title, subject, author (the vendor), keywords
 * (part number, class), and creation and modification dates taken from the
 * part's `date` rather than the clock, so that the same inputs give the same
 * metadata. Chromium writes only a title; pdf-lib (a general-purpose PDF
 * library) sets the rest and rewrites the file, keeping the outline and the
 * tagged structure.
 */
import { PDFDocument } from 'pdf-lib';
import { drawRunningText, type RunningText } from './running.js';

export interface PdfMetadata {
  readonly title: string;
  readonly subject: string;
  readonly author: string;
  readonly keywords: readonly string[];
  /** The part's date (YYYY-MM-DD), or null when it has none (then the Unix epoch, still not the clock). */
  readonly date: string | null;
  readonly creator: string;
}

export function metadataDate(date: string | null): Date {
  const m = date ? /^(\d{4})-(\d{2})-(\d{2})$/.exec(date) : null;
  return m ? new Date(Date.UTC(Number(m[1]), Number(m[2]) - 1, Number(m[3]))) : new Date(0);
}

export async function setPdfMetadata(bytes: Uint8Array, meta: PdfMetadata, running?: RunningText): Promise<Uint8Array> {
  const doc = await PDFDocument.load(bytes, { updateMetadata: false });
  if (running) await drawRunningText(doc, running);
  const when = metadataDate(meta.date);
  doc.setTitle(meta.title, { showInWindowTitleBar: true });
  doc.setSubject(meta.subject);
  doc.setAuthor(meta.author);
  doc.setKeywords([...meta.keywords]);
  doc.setCreator(meta.creator);
  doc.setProducer(`${meta.creator}; pages printed by Chromium (Skia/PDF)`);
  doc.setCreationDate(when);
  doc.setModificationDate(when);
  return doc.save({ useObjectStreams: false });
}
