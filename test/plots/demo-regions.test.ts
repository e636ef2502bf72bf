/**
 * No PASS part inside a forbidden region: on every plot of every demo part
 * whose limits all pass, no trace, median or spread point lies strictly
 * inside a shaded region (a region is drawn only where its limit applies to
 * every trace of the plot, so a passing part must stay out of it).
 */
import { readdirSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { evaluatePartFile } from '../../src/pipeline/part.js';
import { buildPlots } from '../../src/plots/model.js';

const ROOT = join(import.meta.dirname, '../..');
const slugs = readdirSync(join(ROOT, 'content/parts'))
  .filter((d) => !d.startsWith('.'))
  .sort();

describe('demo plots', () => {
  it.each(slugs)('%s: a passing part stays out of every shaded region', async (slug) => {
    const o = await evaluatePartFile(join(ROOT, 'content/parts', slug, 'part.yaml'), join(ROOT, 'content'));
    expect(o.errors).toEqual([]);
    const result = o.result!;
    const plots = buildPlots(o.part!, o.units);
    expect(plots.length).toBeGreaterThan(0);
    if (!result.pass) return; // (the demo attenuator has a damaged unit and fails: its page says so)
    for (const p of plots) {
      const tol = 1e-9 * (p.yDomain[1] - p.yDomain[0]);
      for (const r of p.regions) {
        const inside = (x: number, y: number) => x > r.x0 && x < r.x1 && y > Math.min(r.y0, r.y1) + tol && y < Math.max(r.y0, r.y1) - tol;
        for (const t of [...p.traces, ...p.median])
          expect(inside(t.x, t.y), `${slug} ${p.title}: ${t.trace} at ${t.x}, ${t.y} inside ${JSON.stringify(r)}`).toBe(false);
      }
    }
  });
});
