/**
 * Which folder a build may replace. A build swaps its output folder whole, so
 * the folder must be one that holds nothing a user could lose: absent, empty,
 * or a site scatterbook built before (recognised by the marker file every
 * build writes at its root). It may never be the content folder, inside it or
 * above it, the working folder or one of its parents, or the home folder or
 * one of its parents. The check only reads.
 */
import { lstatSync, readdirSync, realpathSync, statSync } from 'node:fs';
import { homedir } from 'node:os';
import { dirname, isAbsolute, join, parse, relative, resolve, sep } from 'node:path';

/** Written at the root of every site scatterbook builds; its presence is what lets a later build replace the folder. */
export const SITE_MARKER = '.scatterbook-site';
export const SITE_MARKER_TEXT = 'This folder is a site built by scatterbook. A later build replaces all of it.\n';

export interface OutputPlaces {
  readonly content: string;
  readonly cwd: string;
  readonly home?: string;
}

/** The path with links resolved as far as it exists (the rest appended), so that aliases of one folder compare equal. */
export function realPath(p: string): string {
  const abs = resolve(p);
  const tail: string[] = [];
  let cur = abs;
  for (;;) {
    try {
      return join(realpathSync(cur), ...tail.reverse());
    } catch {
      const up = dirname(cur);
      if (up === cur) return abs;
      tail.push(cur.slice(up.length).replace(/^[\\/]+/, ''));
      cur = up;
    }
  }
}

/** True when `inner` is `outer` or lies below it (both already real). */
export function within(outer: string, inner: string): boolean {
  const rel = relative(outer, inner);
  return rel === '' || (!rel.startsWith(`..${sep}`) && rel !== '..' && !isAbsolute(rel));
}

/**
 * Why `out` may not be a build's output folder, or null when it may.
 * `shown` is how the message names the folder.
 */
export function outputRefusal(out: string, places: OutputPlaces, shown = out): string | null {
  const target = realPath(out);
  const content = realPath(places.content);
  const cwd = realPath(places.cwd);
  const home = places.home ?? homedir();
  const why = (reason: string) =>
    `--out ${shown}: ${reason}; a build replaces its output folder whole, so it must be absent, empty, or a site scatterbook built; nothing was touched`;
  if (target === parse(target).root) return why('is the root of the file system');
  if (target === content) return why('is the content folder');
  if (within(content, target)) return why('lies inside the content folder');
  if (within(target, content)) return why('holds the content folder');
  if (within(target, cwd)) return why(target === cwd ? 'is the working folder' : 'holds the working folder');
  if (home && within(target, realPath(home))) return why(target === realPath(home) ? 'is the home folder' : 'holds the home folder');
  let st;
  try {
    st = lstatSync(target);
  } catch {
    return null; // absent: the build creates it
  }
  if (st.isSymbolicLink()) {
    try {
      st = statSync(target);
    } catch {
      return why('is a broken link');
    }
  }
  if (!st.isDirectory()) return why(st.isFile() ? 'is a file, not a folder' : 'is not a folder');
  let entries: string[];
  try {
    entries = readdirSync(target);
  } catch (e) {
    return `--out ${shown}: cannot read the folder (${(e as NodeJS.ErrnoException).code ?? (e as Error).message}); nothing was touched`;
  }
  if (entries.length === 0 || entries.includes(SITE_MARKER)) return null;
  return why(`holds ${entries.length} entr${entries.length === 1 ? 'y' : 'ies'} but is not a site scatterbook built (it has no ${SITE_MARKER} file)`);
}
