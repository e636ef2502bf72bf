/** The demo generator: deterministic, and its passive parts come out passive and reciprocal. */
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { DEMO_PARTS, partFiles } from '../../src/demo/catalog.js';
import { passivity, reciprocity } from '../../src/network/quality.js';
import { readTouchstone } from '../../src/touchstone/read.js';

const CONTENT = join(import.meta.dirname, '../../content/parts');

describe('demo catalog data', () => {
  for (const part of DEMO_PARTS) {
    it(`${part.slug}: the generator reproduces the committed files byte for byte, and they are passive and reciprocal`, () => {
      for (const [rel, text] of partFiles(part)) {
        const committed = readFileSync(join(CONTENT, part.slug, rel), 'utf8');
        expect(text === committed, `${part.slug}/${rel} differs from the generator's output: run npm run demo:data`).toBe(true);
        const r = readTouchstone(text, { fileName: rel });
        expect(r.errors).toEqual([]);
        expect(passivity(r.value!.network).passive).toBe(true);
        expect(reciprocity(r.value!.network).reciprocal).toBe(true);
      }
    });
  }
});
