/**
 * Fixed-seed fuzzing of part files (test/support/part-fuzz.ts): mutated demo
 * part files load, evaluate and build their plot models or give positioned
 * errors — never an exception. The seed is fixed so a failure is repeatable;
 * `npm run bench:fuzz` runs the same property longer with a seed of its own.
 */
import fc from 'fast-check';
import { beforeAll, describe, it } from 'vitest';
import { demoBases, mutate, mutationArb, survives, type Base } from '../support/part-fuzz.js';

let bases: Base[];
beforeAll(async () => {
  bases = await demoBases();
}, 60_000);

describe('part files, mutated (fast-check, seed 20261202)', () => {
  it('one to four mutations of a demo part file: a value or positioned errors, never an exception', async () => {
    await fc.assert(
      fc.asyncProperty(fc.nat(), fc.array(mutationArb, { minLength: 1, maxLength: 4 }), async (which, ms) => {
        const base = bases[which % bases.length];
        await survives(base, ms.reduce(mutate, base.text));
      }),
      { seed: 20261202, numRuns: 400 },
    );
  }, 120_000);
});
