/**
 * `npm run demo:data`: writes the demo catalog's Touchstone files under
 * content/parts/<slug>/ and the demo comparison's under content/comparisons/data/. Deterministic: the same sources give the same bytes.
 */
import { mkdirSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { writeFileAtomic } from '../io/atomic.js';
import { DEMO_PARTS, partFiles } from './catalog.js';
import { candidateFiles } from './comparison.js';

const root = process.argv[2] ?? 'content';
let count = 0;
for (const part of DEMO_PARTS) {
  for (const [rel, text] of partFiles(part)) {
    const path = join(root, 'parts', part.slug, rel);
    mkdirSync(dirname(path), { recursive: true });
    writeFileAtomic(path, text);
    count++;
  }
}
for (const [rel, text] of candidateFiles()) {
  const path = join(root, 'comparisons', rel);
  mkdirSync(dirname(path), { recursive: true });
  writeFileAtomic(path, text);
  count++;
}
process.stdout.write(`wrote ${count} Touchstone files under ${join(root, 'parts')} and ${join(root, 'comparisons')}\n`);
