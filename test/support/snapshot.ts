/** Every file below a folder with its SHA-256 (links not followed): a state to compare byte for byte. */
import { createHash } from 'node:crypto';
import { lstatSync, readdirSync, readFileSync } from 'node:fs';
import { join, relative } from 'node:path';

export function snapshot(root: string): Record<string, string> {
  const out: Record<string, string> = {};
  const walk = (d: string) => {
    for (const name of readdirSync(d)) {
      const p = join(d, name);
      const st = lstatSync(p);
      if (st.isDirectory()) walk(p);
      else out[relative(root, p)] = st.isFile() ? createHash('sha256').update(readFileSync(p)).digest('hex') : st.isSymbolicLink() ? 'link' : 'special';
    }
  };
  walk(root);
  return out;
}
