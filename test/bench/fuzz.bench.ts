/**
 * A longer fuzz run of part files than CI's fixed-seed test (test/part-file/fuzz.test.ts):
 * FUZZ_RUNS runs (default 20,000) from FUZZ_SEED (default: the clock, printed, so
 * a failure can be repeated). Prints how many mutated files loaded, how many were
 * refused with errors, and the runs per second. `npm run bench:fuzz`. Not a test.
 */
import fc from 'fast-check';
import { demoBases, mutate, mutationArb, survives } from '../support/part-fuzz.js';

const runs = Number(process.env.FUZZ_RUNS ?? 20_000);
const seed = Number(process.env.FUZZ_SEED ?? Date.now() % 2 ** 31);
const bases = await demoBases();
let valid = 0;
let refused = 0;
const t0 = performance.now();
console.log(`part-file fuzzing: ${runs} runs, seed ${seed} (FUZZ_SEED=${seed} repeats it)`);
await fc.assert(
  fc.asyncProperty(fc.nat(), fc.array(mutationArb, { minLength: 1, maxLength: 6 }), async (which, ms) => {
    const base = bases[which % bases.length];
    const text = ms.reduce(mutate, base.text);
    if ((await survives(base, text)) === 'evaluated') valid++;
    else refused++;
  }),
  { seed, numRuns: runs },
);
const s = (performance.now() - t0) / 1000;
console.log(`no exception: ${valid} mutated files evaluated, ${refused} refused with positioned errors; ${(runs / s).toFixed(0)} runs per second`);
