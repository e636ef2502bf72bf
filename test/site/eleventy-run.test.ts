/**
 * Each Eleventy run gets its catalog through its own plugin options (Eleventy's
 * `config` option), not through module state: two sites written at once in one
 * process each hold their own parts only.
 */
import { mkdtempSync, readFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { buildCatalog } from '../../src/pipeline/build-catalog.js';
import { writeSite } from '../../src/site/eleventy-run.js';
import { tinyContent } from '../helpers.js';

const content = (root: string, slug: string) => tinyContent(join(root, slug, 'content'), [slug]);

describe('two Eleventy runs in one process', () => {
  it('written at the same time, each site has its own catalog', async () => {
    const root = mkdtempSync(join(tmpdir(), 'scatterbook-two-runs-'));
    const a = content(root, 'alpha-1'),
      b = content(root, 'beta-2');
    const [ca, cb] = await Promise.all([buildCatalog(a, { version: 'test', cacheDir: null }), buildCatalog(b, { version: 'test', cacheDir: null })]);
    await Promise.all([writeSite(a, ca.catalog, join(root, 'site-a')), writeSite(b, cb.catalog, join(root, 'site-b'))]);
    const ia = readFileSync(join(root, 'site-a/index.html'), 'utf8');
    const ib = readFileSync(join(root, 'site-b/index.html'), 'utf8');
    expect(ia).toContain('ALPHA-1');
    expect(ia).not.toContain('BETA-2');
    expect(ib).toContain('BETA-2');
    expect(ib).not.toContain('ALPHA-1');
  }, 60_000);
});
