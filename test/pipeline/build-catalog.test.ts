/**
 * A bug met while building one part (an exception that is no fault of its
 * files) becomes that part's failure, marked internal, instead of ending the
 * build: `build --keep-going` then publishes the other parts and lists it,
 * and the build exits 4 asking for a report (build-command.ts). The bug is
 * simulated by a buildPartPage that throws for one slug.
 */
import { mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it, vi } from 'vitest';
import { tinyContent } from '../helpers.js';

vi.mock('../../src/pipeline/part-page.js', async (original) => {
  const real = await original<typeof import('../../src/pipeline/part-page.js')>();
  return {
    ...real,
    buildPartPage: (...args: Parameters<typeof real.buildPartPage>) => {
      if (args[2] === 'buggy') throw new TypeError("Cannot read properties of undefined (reading 'length')");
      if (args[2] === 'disk-full') throw Object.assign(new Error('ENOSPC: no space left on device, write'), { code: 'ENOSPC' });
      return real.buildPartPage(...args);
    },
  };
});

const { buildCatalog } = await import('../../src/pipeline/build-catalog.js');

const content = (slugs: string[]) => tinyContent(join(mkdtempSync(join(tmpdir(), 'scatterbook-internal-')), 'content'), slugs);

describe('a bug on one part', () => {
  it("is that part's failure, marked internal, with the part file named; the other part is built", async () => {
    const b = await buildCatalog(content(['buggy', 'fine']), { version: 'test', cacheDir: null });
    expect(b.catalog.parts.map((p) => p.slug)).toEqual(['fine']);
    expect(b.catalog.failures).toHaveLength(1);
    const f = b.catalog.failures[0];
    expect(f).toMatchObject({ slug: 'buggy', internal: true });
    expect(f.messages[0]).toMatch(/parts\/buggy\/part\.yaml: internal error while building this part \(a bug in scatterbook; please report it/);
    expect(f.messages[0]).toContain("Cannot read properties of undefined (reading 'length')");
  });

  it('a fault of the machine (a full disk) still stops the build', async () => {
    await expect(buildCatalog(content(['disk-full', 'fine']), { version: 'test', cacheDir: null })).rejects.toThrow('ENOSPC');
  });
});
