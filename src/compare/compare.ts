/**
 * Candidates side by side against one requirement, by the figure engine's own
 * rules (evaluatePart: band sets with interpolated edges, margins, worst,
 * typical): every candidate's units renormalized to the comparison's
 * reference first (power-wave renormalization, network/convert.ts), never
 * extrapolated. A candidate whose data do not cover a limit's band entirely
 * is evaluated on the limits it does cover, has coverage "partial", does not
 * pass and is not ranked. Candidates with full coverage are ranked by their
 * least margin over all limits (larger is better), ties broken by the
 * next-least margin, then by input order. Values only: no files.
 */
import { evaluatePart, gridOf, type PartResult, type UnitData } from '../evaluate/evaluate.js';
import { renormalize } from '../network/convert.js';
import type { SpecError } from '../spec/diagnostics.js';
import type { NormalizedCheck, NormalizedPart } from '../spec/normalize.js';

export interface Candidate {
  readonly label: string;
  readonly units: readonly UnitData[];
}

export interface Gap {
  readonly band: string;
  readonly fromHz: number;
  readonly toHz: number;
  /** What the candidate's data cover of the band, or null when none of it. */
  readonly coveredFromHz: number | null;
  readonly coveredToHz: number | null;
  readonly unit: string;
}

export interface CandidateResult {
  readonly label: string;
  readonly coverage: 'full' | 'partial';
  readonly gaps: readonly Gap[];
  readonly result: PartResult | null;
  readonly errors: readonly SpecError[];
  readonly pass: boolean;
  readonly rank: number | null;
  /** Its limits' margins, least first (the ranking key). */
  readonly margins: readonly number[];
}

/** Where a unit's data leave a check's band uncovered (on the grid the check is evaluated on), or null when they cover it. */
function gapOf(u: UnitData, check: NormalizedCheck): Gap | null {
  const band = check.band;
  const f = gridOf(check, u);
  if (!f) return { band: band.name, fromHz: band.fromHz, toHz: band.toHz, coveredFromHz: null, coveredToHz: null, unit: u.unit };
  const lo = f[0], hi = f[f.length - 1];
  if (band.fromHz >= lo && band.toHz <= hi) return null;
  const from = Math.max(lo, band.fromHz), to = Math.min(hi, band.toHz);
  const any = from <= to;
  return { band: band.name, fromHz: band.fromHz, toHz: band.toHz, coveredFromHz: any ? from : null, coveredToHz: any ? to : null, unit: u.unit };
}

/** b ranks before a when its least margin is larger (then its next-least, …). */
function byMargins(a: readonly number[], b: readonly number[]): number {
  for (let i = 0; i < Math.max(a.length, b.length); i++) {
    const x = a[i] ?? Infinity, y = b[i] ?? Infinity;
    if (x !== y) return y - x > 0 ? 1 : -1;
  }
  return 0;
}

export function compareCandidates(requirement: NormalizedPart, candidates: readonly Candidate[], referenceOhms: number): CandidateResult[] {
  const out = candidates.map((c): Omit<CandidateResult, 'rank'> => {
    const units = c.units.map((u) => ({ ...u, network: renormalize(u.network, referenceOhms) }));
    const gaps: Gap[] = [];
    const covered = requirement.checks.filter((check) => {
      const own = units.map((u) => gapOf(u, check)).filter((g): g is Gap => g !== null);
      for (const g of own) if (!gaps.some((x) => x.band === g.band && x.unit === g.unit)) gaps.push(g);
      return own.length === 0;
    });
    const evaluated = evaluatePart({ ...requirement, checks: covered }, units);
    const result = evaluated.value;
    const margins = (result?.results ?? []).filter((r) => r.kind === 'limit' && r.margin !== null).map((r) => r.margin as number).sort((a, b) => a - b);
    const coverage = gaps.length ? 'partial' : 'full';
    return { label: c.label, coverage, gaps, result, errors: evaluated.errors, pass: coverage === 'full' && result !== null && result.pass, margins };
  });
  const ranked = out.map((c, i) => ({ c, i })).filter((x) => x.c.coverage === 'full' && x.c.result).sort((a, b) => byMargins(a.c.margins, b.c.margins) || a.i - b.i);
  const rankOf = new Map(ranked.map((x, k) => [x.i, k + 1]));
  return out.map((c, i) => ({ ...c, rank: rankOf.get(i) ?? null }));
}
