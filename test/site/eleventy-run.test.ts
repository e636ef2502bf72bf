/**
 * Each Eleventy run gets its catalog through its own plugin options (Eleventy's
 * `config` option), not through module state: two sites written at once in one
 * process each hold their own parts only.
 */
import { mkdirSync, mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { buildCatalog } from '../../src/pipeline/build-catalog.js';
import { writeSite } from '../../src/site/eleventy-run.js';

const DATA = '# GHz S MA R 50\n1 0.1 0 0.9 -10 0.9 -10 0.1 0\n2 0.1 0 0.9 -20 0.9 -20 0.1 0\n';
function content(root: string, slug: string): string {
  const dir = join(root, slug, 'content');
  mkdirSync(join(dir, 'parts', slug, 'data'), { recursive: true });
  writeFileSync(join(dir, 'parts', slug, 'data/u1.s2p'), DATA);
  writeFileSync(
    join(dir, 'parts', slug, 'part.yaml'),
    `part: ${slug.toUpperCase()}\nrevision: A\nclass: attenuator\nmeasurements:\n  - {unit: U1, file: data/u1.s2p}\nbands:\n  b: {from: 1 GHz, to: 2 GHz}\nlimits:\n  - {figure: insertion-loss, on: S21, band: b, max: 2 dB}\n`,
  );
  return dir;
}

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
