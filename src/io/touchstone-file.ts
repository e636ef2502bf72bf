/**
 * Reading a Touchstone file from disk: streamed through the parser in fixed
 * chunks, so memory holds the numbers and one chunk, not the whole text
 * (unless keepText asks for the text too).
 */
import { createHash } from 'node:crypto';
import { closeSync, fstatSync, openSync, readSync, statSync } from 'node:fs';
import { notAFile } from './text-file.js';
import { basename } from 'node:path';
import { TouchstoneParser } from '../touchstone/parse.js';
import { fromParsed, type ReadResult } from '../touchstone/read.js';

const CHUNK = 1 << 20;

export interface FileReadResult extends ReadResult {
  readonly bytes: number;
  /** With keepText: the file's bytes and where each network value's text is in them (TouchstoneRecord.tokens). */
  readonly text?: { readonly source: Uint8Array; readonly tokens: Float64Array };
  /** SHA-256 of the file's bytes, hex (for provenance records). */
  readonly sha256: string;
}

export interface FileReadOptions {
  /** Port count for a version 1 file whose name has no .sNp extension. */
  readonly ports?: number;
  /** Called after each chunk with the bytes read so far and the file size (for progress displays). */
  readonly onProgress?: (bytesRead: number, size: number) => void;
  /** Keep the file's bytes and each value's place in them, for writers that copy numbers as written (read --json). */
  readonly keepText?: boolean;
  /** Compute the file's SHA-256 (default true; sha256 is '' without it). */
  readonly hash?: boolean;
}

/** Reads and parses; a file that cannot be opened comes back as an error, like bad content. */
export function readTouchstoneFile(path: string, options: FileReadOptions = {}): FileReadResult {
  const { ports, onProgress, keepText, hash: hashing = true } = options;
  let fd: number;
  try {
    // a folder, a FIFO (which would block an open) or a device is named as such
    const not = notAFile(statSync(path));
    if (not) return { value: null, errors: [{ code: 'not-text', line: 0, message: `cannot read the file: it ${not}` }], warnings: [], bytes: 0, sha256: '' };
    fd = openSync(path, 'r');
  } catch (e) {
    const err = e as NodeJS.ErrnoException;
    const what =
      err.code === 'ENOENT' ? 'no such file' : err.code === 'EISDIR' ? 'is a folder, not a file' : err.code === 'EACCES' ? 'permission denied' : err.message;
    return { value: null, errors: [{ code: 'not-text', line: 0, message: `cannot read the file: ${what}` }], warnings: [], bytes: 0, sha256: '' };
  }
  try {
    const size = fstatSync(fd).size;
    const parser = new TouchstoneParser({ fileName: basename(path), sizeHint: size, ports, keepTokens: keepText });
    const kept: Uint8Array[] = [];
    const chunk = new Uint8Array(Math.min(CHUNK, Math.max(size, 1)));
    const hash = createHash('sha256');
    let total = 0;
    for (;;) {
      const got = readSync(fd, chunk, 0, chunk.length, null);
      if (got === 0) break;
      total += got;
      if (hashing) hash.update(chunk.subarray(0, got));
      parser.push(chunk.subarray(0, got));
      if (keepText) kept.push(chunk.slice(0, got));
      onProgress?.(total, size);
    }
    const parsed = parser.finish();
    const tokens = parsed.record?.tokens;
    const text = keepText && tokens ? { source: Buffer.concat(kept), tokens } : undefined;
    return { ...fromParsed(parsed), bytes: total, sha256: hashing ? hash.digest('hex') : '', ...(text ? { text } : {}) };
  } catch (e) {
    const err = e as NodeJS.ErrnoException;
    return {
      value: null,
      errors: [{ code: 'not-text', line: 0, message: `cannot read the file: ${err.code === 'EISDIR' ? 'is a folder, not a file' : err.message}` }],
      warnings: [],
      bytes: 0,
      sha256: '',
    };
  } finally {
    closeSync(fd);
  }
}
