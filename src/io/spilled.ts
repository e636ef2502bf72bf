/**
 * Reading back what a build keeps in files until the pages are written
 * (pipeline/spill.ts writes them): a plot's SVG and a median file's text,
 * from the page model itself or from the file it names.
 */
import { readFileSync } from 'node:fs';

/** A plot's SVG, from the page or from its file. */
export const svgOf = (p: { svg: string; svgFile?: string }) => p.svg || (p.svgFile ? readFileSync(p.svgFile, 'utf8') : '');

/** A median file's text, from the page or from its file. */
export const medianText = (m: { text: string; file?: string }) => m.text || (m.file ? readFileSync(m.file, 'utf8') : '');
