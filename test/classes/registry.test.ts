/**
 * The class registry: every class is complete (a title, plots of figures that
 * exist and are drawn per point, headline figures that exist, cautions that
 * end in the closing line), and the defaults it holds are the trade's:
 * a hybrid or coupler splits two ways, a divider ports − 1 (excess loss over
 * the ideal split, common practice); a quadrature hybrid is nominally 90°
 * apart, a balun 180° (common practice); only amplifiers are active; ferrite
 * parts are not reciprocal (Pozar, Microwave Engineering, ch. 9, from memory).
 */
import { describe, expect, it } from 'vitest';
import { CLASSES, classOf } from '../../src/classes/registry.js';
import { FIGURES } from '../../src/figures/registry.js';
import { PART_SCHEMA } from '../../src/part-file/part-schema.js';
import { cautionsFor } from '../../src/classes/cautions.js';

describe('the class registry', () => {
  it("is the part file's list of classes", () => {
    if (PART_SCHEMA.t !== 'object') throw new Error('object schema');
    const cls = PART_SCHEMA.fields.class;
    expect(cls.t === 'string' && cls.enum).toEqual(CLASSES);
  });

  it.each(CLASSES)('%s is complete', (id) => {
    const c = classOf(id);
    expect(c.id).toBe(id);
    expect(c.title.length).toBeGreaterThan(3);
    if (id !== 'generic') {
      expect(c.plots.length, 'plots').toBeGreaterThan(0);
      expect(c.headline.length, 'headline').toBeGreaterThan(0);
    }
    for (const p of c.plots) {
      if (p.figure === 'smith') continue; // a plot of its own kind, not a figure
      const f = FIGURES.get(p.figure);
      expect(f, p.figure).toBeDefined();
      expect(f?.shape, `${p.figure} is drawn per point`).toBe('trace');
      for (const l of p.limitsFrom ?? []) expect(FIGURES.has(l), l).toBe(true);
    }
    for (const h of c.headline) expect(FIGURES.has(h), h).toBe(true);
    expect(c.cautions.length).toBeGreaterThan(0);
    expect(cautionsFor(id, []).at(-1)).toContain('Local safety codes, RF-exposure regulations and licensed practice');
    expect(Number.isInteger(c.ways(4)) && c.ways(4) >= 1).toBe(true);
  });

  it("holds the trade's defaults", () => {
    expect([classOf('divider').ways(3), classOf('divider').ways(5)]).toEqual([2, 4]);
    expect([classOf('hybrid').ways(4), classOf('coupler').ways(4), classOf('balun').ways(3)]).toEqual([2, 2, 2]);
    expect([classOf('hybrid').phaseSplitDeg, classOf('balun').phaseSplitDeg, classOf('divider').phaseSplitDeg]).toEqual([90, 180, 0]);
    expect(CLASSES.filter((c) => !classOf(c).passive)).toEqual(['amplifier']);
    expect(CLASSES.filter((c) => !classOf(c).reciprocal)).toEqual(['amplifier', 'circulator', 'isolator']);
  });
});
