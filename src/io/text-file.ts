/**
 * Reading a small text file the user wrote (a part file, site.yaml): what is
 * at the path is checked before it is opened, so a folder, a FIFO or a device
 * is named as such (and a FIFO never blocks the build), and an oversized file
 * is refused unread.
 */
import { closeSync, fstatSync, openSync, readSync, statSync, constants } from 'node:fs';
import { decodeYamlSource, MAX_YAML_BYTES, tooLargeError, type SourceResult } from '../part-file/source.js';

/** What a path that is not a regular file holds, in words, or null for a regular file. */
export function notAFile(st: {
  isFile(): boolean;
  isDirectory(): boolean;
  isFIFO(): boolean;
  isSocket(): boolean;
  isCharacterDevice(): boolean;
  isBlockDevice(): boolean;
}): string | null {
  if (st.isFile()) return null;
  if (st.isDirectory()) return 'is a folder, not a file';
  if (st.isFIFO()) return 'is a named pipe (FIFO), not a file';
  if (st.isSocket()) return 'is a socket, not a file';
  if (st.isCharacterDevice() || st.isBlockDevice()) return 'is a device, not a file';
  return 'is not a regular file';
}

/**
 * The decoded text of a YAML file, or one error (`line` 0: about the file as a
 * whole). `missing` is true when nothing is at the path.
 */
export function readYamlFile(path: string, shown: string, what = 'the part file'): SourceResult & { readonly missing?: boolean } {
  const fail = (message: string, missing = false) => ({
    ok: false as const,
    missing,
    error: { code: 'missing-file' as const, file: shown, line: 0, column: 0, message },
  });
  let st;
  try {
    st = statSync(path);
  } catch (e) {
    const code = (e as NodeJS.ErrnoException).code;
    return code === 'ENOENT' ? fail(`${what} does not exist`, true) : fail(`cannot read ${what}: ${(e as Error).message}`);
  }
  const not = notAFile(st);
  if (not) return fail(`${what} ${not}`);
  if (st.size > MAX_YAML_BYTES) return { ok: false, error: tooLargeError(st.size, shown, what) };
  let fd: number;
  try {
    fd = openSync(path, constants.O_RDONLY | (constants.O_NONBLOCK ?? 0));
  } catch (e) {
    return fail(`cannot read ${what}: ${(e as Error).message}`);
  }
  try {
    const size = fstatSync(fd).size;
    const bytes = new Uint8Array(Math.min(size, MAX_YAML_BYTES + 1));
    let got = 0;
    while (got < bytes.length) {
      const n = readSync(fd, bytes, got, bytes.length - got, null);
      if (n === 0) break;
      got += n;
    }
    return decodeYamlSource(bytes.subarray(0, got), shown, what);
  } catch (e) {
    return fail(`cannot read ${what}: ${(e as Error).message}`);
  } finally {
    closeSync(fd);
  }
}
