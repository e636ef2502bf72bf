/**
 * The demo generator: deterministic (it reproduces the committed files byte
 * for byte), and its models behave as the physics says: passive parts are
 * passive, reciprocal parts reciprocal, by our own quality checks; the
 * isolator is passive but not reciprocal; the amplifier is active.
 */
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { parse } from 'yaml';
import { classOf } from '../../src/classes/registry.js';
import { DEMO_PARTS, partFiles } from '../../src/demo/catalog.js';
import { passivity, reciprocity } from '../../src/network/quality.js';
import { readTouchstone } from '../../src/touchstone/read.js';

const CONTENT = join(import.meta.dirname, '../../content/parts');

describe('demo catalog data', () => {
  it('covers the classes the site issue asks for, with 3 to 5 units each', () => {
    const classes = DEMO_PARTS.map((p) => (parse(readFileSync(join(CONTENT, p.slug, 'part.yaml'), 'utf8')) as { class: string }).class);
    for (const c of ['filter', 'attenuator', 'amplifier', 'divider', 'coupler', 'hybrid', 'isolator', 'cable']) expect(classes).toContain(c);
    for (const p of DEMO_PARTS) {
      const serials = new Set(p.units.map((u) => u.serial));
      expect(serials.size, p.slug).toBeGreaterThanOrEqual(3);
      expect(serials.size, p.slug).toBeLessThanOrEqual(5);
    }
  });

  for (const part of DEMO_PARTS) {
    it(`${part.slug}: reproduced byte for byte; passivity and reciprocity as its class expects`, () => {
      const cls = (parse(readFileSync(join(CONTENT, part.slug, 'part.yaml'), 'utf8')) as { class: string }).class;
      for (const [rel, text] of partFiles(part)) {
        const committed = readFileSync(join(CONTENT, part.slug, rel), 'utf8');
        expect(text === committed, `${part.slug}/${rel} differs from the generator's output: run npm run demo:data`).toBe(true);
        const r = readTouchstone(text, { fileName: rel });
        expect(r.errors).toEqual([]);
        const net = r.value!.network;
        expect(net.ports).toBe(part.ports);
        expect(passivity(net).passive, `${rel} passive`).toBe(classOf(cls).passive);
        expect(reciprocity(net).reciprocal, `${rel} reciprocal`).toBe(classOf(cls).reciprocal);
      }
    });
  }
});

describe('demo comparison data', () => {
  it('reproduced byte for byte; one file on another grid, one at 75 Ω with its ports turned round, one short of the band', async () => {
    const { candidateFiles } = await import('../../src/demo/comparison.js');
    const files = candidateFiles();
    expect(files.size).toBeGreaterThanOrEqual(3);
    const nets = new Map<string, ReturnType<typeof readTouchstone>['value']>();
    for (const [rel, text] of files) {
      const committed = readFileSync(join(CONTENT, '../comparisons', rel), 'utf8');
      expect(text === committed, `comparisons/${rel} differs from the generator's output: run npm run demo:data`).toBe(true);
      const r = readTouchstone(text, { fileName: rel });
      expect(r.errors).toEqual([]);
      expect(passivity(r.value!.network).passive, rel).toBe(true);
      nets.set(rel, r.value);
    }
    const [orrin, tallow, short] = ['data/orrin-or-bp24/unit-a.s2p', 'data/tallowmere-tc-2442f/sn0117.s2p', 'data/tallowmere-tc-2440n/sn0042.s2p'].map(
      (f) => nets.get(f)!.network,
    );
    expect(orrin.freqHz[1] - orrin.freqHz[0]).toBe(6.25e6);
    expect(Array.from(tallow.z0)).toEqual([75, 75]);
    expect(short.freqHz.at(-1)).toBe(2.47e9);
  });
});
