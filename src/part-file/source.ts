/**
 * The bytes of a YAML file (a part file, site.yaml) → its text, or one
 * positioned error: files above a size no part file reaches are refused before
 * they are parsed, and the text must be UTF-8 without NUL bytes (YAML 1.2
 * allows neither a NUL nor, in a UTF-8 stream, bytes of another encoding).
 */
import type { SpecError } from './diagnostics.js';

/** Part files and site.yaml larger than this are refused at once (the largest demo part is about 4 KB). */
export const MAX_YAML_BYTES = 1 << 20;

export type SourceResult = { readonly ok: true; readonly text: string } | { readonly ok: false; readonly error: SpecError };

export function tooLargeError(size: number, file: string, what: string): SpecError {
  return {
    code: 'bad-encoding',
    file,
    line: 0,
    column: 0,
    message: `${what} is ${size} bytes; files above ${MAX_YAML_BYTES} bytes (1 MiB) are refused unread, as no part description needs that much: is it the right file?`,
  };
}

/** Line and column (1-based, in characters) of byte `offset` of a UTF-8 text. */
function positionOf(bytes: Uint8Array, offset: number): { line: number; column: number } {
  let line = 1,
    start = 0;
  for (let i = 0; i < offset; i++) if (bytes[i] === 0x0a) line++, (start = i + 1);
  const before = new TextDecoder('utf-8').decode(bytes.subarray(start, offset));
  return { line, column: [...before].length + 1 };
}

/** Length of the valid UTF-8 sequence starting at i, or 0 where it is not one. */
function utf8Length(b: Uint8Array, i: number): number {
  const c = b[i];
  if (c < 0x80) return 1;
  const cont = (k: number) => i + k < b.length && (b[i + k] & 0xc0) === 0x80;
  if (c >= 0xc2 && c <= 0xdf) return cont(1) ? 2 : 0;
  if (c >= 0xe0 && c <= 0xef) {
    if (!cont(1) || !cont(2)) return 0;
    const v = ((c & 0x0f) << 12) | ((b[i + 1] & 0x3f) << 6);
    return v < 0x800 || (v >= 0xd800 && v <= 0xdfff) ? 0 : 3;
  }
  if (c >= 0xf0 && c <= 0xf4) {
    if (!cont(1) || !cont(2) || !cont(3)) return 0;
    const v = ((c & 0x07) << 18) | ((b[i + 1] & 0x3f) << 12);
    return v < 0x10000 || v > 0x10ffff ? 0 : 4;
  }
  return 0;
}

export function decodeYamlSource(bytes: Uint8Array, file: string, what = 'the part file'): SourceResult {
  const fail = (message: string, at = { line: 0, column: 0 }): SourceResult => ({ ok: false, error: { code: 'bad-encoding', file, message, ...at } });
  if (bytes.length > MAX_YAML_BYTES) return { ok: false, error: tooLargeError(bytes.length, file, what) };
  if (bytes.length >= 2 && ((bytes[0] === 0xff && bytes[1] === 0xfe) || (bytes[0] === 0xfe && bytes[1] === 0xff)))
    return fail(`${what} is UTF-16 text (it starts with a UTF-16 byte-order mark); save it as UTF-8`);
  let i = bytes.length >= 3 && bytes[0] === 0xef && bytes[1] === 0xbb && bytes[2] === 0xbf ? 3 : 0;
  const start = i;
  while (i < bytes.length) {
    if (bytes[i] === 0) return fail(`${what} holds a NUL byte (0x00); a YAML file is text: is it a binary or UTF-16 file?`, positionOf(bytes, i));
    const n = utf8Length(bytes, i);
    if (n === 0)
      return fail(
        `byte 0x${bytes[i].toString(16).padStart(2, '0')} is not UTF-8; ${what} must be saved as UTF-8 (Latin-1 and Windows code pages are not read)`,
        positionOf(bytes, i),
      );
    i += n;
  }
  return { ok: true, text: new TextDecoder('utf-8').decode(bytes.subarray(start)) };
}
