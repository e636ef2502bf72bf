/**
 * The content folder's assets/ (logos, stylesheets, outline drawings) copied
 * into the site as regular files only. A link is followed when it points to a
 * file inside the content folder (the site gets a copy of the file, never the
 * link); a link that points outside it, or nowhere, is an error naming it, so
 * nothing outside the content folder can reach a published site.
 */
import { copyFileSync, lstatSync, mkdirSync, readdirSync, realpathSync, statSync } from 'node:fs';
import { dirname, join, relative } from 'node:path';
import { realPath, within } from './output-folder.js';

export interface AssetPlan {
  /** Source file → path relative to the site root. */
  readonly files: ReadonlyArray<{ readonly from: string; readonly to: string }>;
  readonly errors: readonly string[];
}

export function planAssets(contentRoot: string, show: (p: string) => string = (p) => p): AssetPlan {
  const root = join(contentRoot, 'assets');
  const files: Array<{ from: string; to: string }> = [];
  const errors: string[] = [];
  let st;
  try {
    st = lstatSync(root);
  } catch {
    return { files, errors };
  }
  const content = realPath(contentRoot);
  const walk = (dir: string) => {
    for (const name of readdirSync(dir).sort()) {
      const p = join(dir, name);
      const to = relative(contentRoot, p).split('\\').join('/');
      let s = lstatSync(p);
      if (s.isSymbolicLink()) {
        let target: string;
        try {
          target = realpathSync(p);
          s = statSync(p);
        } catch {
          errors.push(`${show(p)}: error: the link points nowhere; assets/ may hold files and links to files inside the content folder`);
          continue;
        }
        if (!within(content, target)) {
          errors.push(`${show(p)}: error: the link points outside the content folder (to ${target}); copy the file into the content folder instead`);
          continue;
        }
        if (s.isFile()) files.push({ from: target, to });
        else if (s.isDirectory()) errors.push(`${show(p)}: error: a link to a folder; assets/ may hold links to files only`);
        continue;
      }
      if (s.isDirectory()) walk(p);
      else if (s.isFile()) files.push({ from: p, to });
      else errors.push(`${show(p)}: error: not a regular file (a FIFO, socket or device); assets/ holds files`);
    }
  };
  if (st.isSymbolicLink()) errors.push(`${show(root)}: error: assets/ is a link; make it a folder of the content folder`);
  else if (st.isDirectory()) walk(root);
  return { files, errors };
}

/** Copies planned assets into the site folder (regular files, written anew). */
export function copyAssets(plan: AssetPlan, siteDir: string): void {
  for (const f of plan.files) {
    const dest = join(siteDir, f.to);
    mkdirSync(dirname(dest), { recursive: true });
    copyFileSync(f.from, dest);
  }
}
