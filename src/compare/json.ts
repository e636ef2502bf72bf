/** A comparison as `scatterbook compare --json` prints it: exactly the documented keys, in order. */
import { figuresJson } from '../evaluate/json.js';
import type { CandidateResult } from './compare.js';

export function comparisonJson(title: string, referenceOhms: number, results: readonly CandidateResult[]): object {
  return {
    title,
    reference: referenceOhms,
    candidates: results.map((c) => ({
      label: c.label,
      rank: c.rank,
      pass: c.pass,
      coverage: c.coverage,
      results: c.result ? (figuresJson(c.result) as { results: unknown[] }).results : [],
    })),
  };
}
