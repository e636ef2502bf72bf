/**
 * Faults of the machine rather than of scatterbook: a folder that cannot be
 * written, a full disk, a path that is a file where a folder is needed. They
 * reach the user as one `error:` line naming the path and the cause (exit 1),
 * never as "a bug in scatterbook".
 */

/** A fault the user can act on, with the whole message already worded. */
export class EnvironmentFault extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'EnvironmentFault';
  }
}

const CAUSES: Record<string, string> = {
  EACCES: 'permission denied',
  EPERM: 'operation not permitted',
  EROFS: 'the file system is read-only',
  ENOSPC: 'no space left on the device',
  EDQUOT: 'the disk quota is used up',
  ENOTDIR: 'a part of the path is a file, not a folder',
  EISDIR: 'is a folder, not a file',
  EEXIST: 'something is already there',
  ENOENT: 'no such file or folder',
  EMFILE: 'too many open files',
  ENFILE: 'too many open files on the system',
  ENAMETOOLONG: 'the name is too long',
  EIO: 'an input/output error of the device',
  EBUSY: 'the file or folder is busy',
  EXDEV: 'the path crosses file systems',
  ENOTEMPTY: 'the folder is not empty',
  ELOOP: 'too many levels of links',
};

interface Errno {
  readonly code: string;
  readonly path?: string;
  readonly dest?: string;
  readonly syscall?: string;
}

/** The file-system error behind `e`, following `cause` and `originalError` (Eleventy wraps them). */
export function errnoOf(e: unknown): Errno | null {
  const seen = new Set<unknown>();
  let cur: unknown = e;
  while (cur && typeof cur === 'object' && !seen.has(cur)) {
    seen.add(cur);
    const c = cur as { code?: unknown; errno?: unknown; cause?: unknown; originalError?: unknown };
    if (typeof c.code === 'string' && c.code in CAUSES && (typeof c.errno === 'number' || 'path' in c)) return c as Errno;
    cur = c.originalError ?? c.cause;
  }
  return null;
}

/** "PATH: no space left on the device (ENOSPC)" (`doing` stands for the path where the error has none), or null when `e` is no file-system fault. */
export function describeFault(e: unknown, show: (path: string) => string = (p) => p, doing?: string): string | null {
  if (e instanceof EnvironmentFault) return e.message;
  const err = errnoOf(e);
  if (!err) return null;
  const where = err.path ? `${show(err.path)}: ` : doing ? `${doing}: ` : '';
  return `${where}${CAUSES[err.code]} (${err.code}${err.syscall ? ` in ${err.syscall}` : ''})`;
}
