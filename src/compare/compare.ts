/**
 * Candidates side by side against one requirement, by the figure engine's own
 * rules (evaluatePart: band sets with interpolated edges, margins, worst,
 * typical). Each candidate's units get its port map first (our port i is the
 * file's port map[i − 1]; file ports left out are terminated in their
 * reference), then are renormalized to the comparison's reference
 * (power-wave renormalization, network/convert.ts); nothing is extrapolated.
 * A candidate whose data do not cover a limit's band entirely is evaluated on
 * the limits it does cover, has coverage "partial", does not pass and is not
 * ranked. Candidates with full coverage are ranked by their least margin over
 * all limits (larger is better; margins of different figures compared in the
 * units the tables show, rankingScale), ties broken by the next-least margin,
 * then by input order. Values only: no files.
 */
import { evaluatePart, gridOf, type CheckResult, type PartResult, type UnitData } from '../evaluate/evaluate.js';
import { renormalize } from '../network/convert.js';
import { selectPorts } from '../network/ports.js';
import type { Position, SpecError, SpecWarning } from '../part-file/diagnostics.js';
import type { NormalizedCheck, NormalizedPart } from '../part-file/normalize.js';

export interface Candidate {
  readonly label: string;
  readonly units: readonly UnitData[];
  /** Our port i (1-based) is the file's port portMap[i − 1]; null or absent: the file's own numbering. */
  readonly portMap?: readonly number[] | null;
  /** Where the candidate is written (its errors are reported there), when it comes from a comparison file. */
  readonly at?: Position;
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

/** One limit's margin, for ranking and its reasons. */
export interface MarginEntry {
  readonly margin: number;
  /** The margin as the tables show it (dB, degrees, ns, MHz, plain numbers): what the ranking compares across figures. */
  readonly key: number;
  readonly check: number;
  readonly label: string;
  readonly on: readonly string[];
  readonly band: string;
  readonly unit: string;
}

export interface CandidateResult {
  readonly label: string;
  readonly coverage: 'full' | 'partial';
  readonly gaps: readonly Gap[];
  readonly result: PartResult | null;
  /** The result of each of the requirement's checks, in its order; null where the candidate's data do not cover the check's band. */
  readonly byCheck: ReadonlyArray<CheckResult | null>;
  /** Its evaluation errors, as the figure engine words them (candidateErrors names the candidates). */
  readonly errors: readonly SpecError[];
  readonly warnings: readonly SpecWarning[];
  readonly pass: boolean;
  readonly rank: number | null;
  /** Its limits' margins in the units the tables show, least first (the ranking key). */
  readonly margins: readonly number[];
  readonly tightest: readonly MarginEntry[];
  /** The units as evaluated: port map applied, renormalized to the reference. */
  readonly units: readonly UnitData[];
}

/** Where a unit's data leave a check's band uncovered (on the grid the check is evaluated on), or null when they cover it. */
function gapOf(u: UnitData, check: NormalizedCheck): Gap | null {
  const band = check.band;
  const f = gridOf(check, u);
  if (!f) return { band: band.name, fromHz: band.fromHz, toHz: band.toHz, coveredFromHz: null, coveredToHz: null, unit: u.unit };
  const lo = f[0],
    hi = f[f.length - 1];
  if (band.fromHz >= lo && band.toHz <= hi) return null;
  const from = Math.max(lo, band.fromHz),
    to = Math.min(hi, band.toHz);
  const any = from <= to;
  return { band: band.name, fromHz: band.fromHz, toHz: band.toHz, coveredFromHz: any ? from : null, coveredToHz: any ? to : null, unit: u.unit };
}

/**
 * Margins of different figures are compared as the tables show them: dB and
 * degrees as they are, times in nanoseconds, frequencies in megahertz, plain
 * numbers (VSWR, K) as they are. (In SI a 3 ns delay margin would be 3e-9 and
 * always look the tightest.)
 */
export function rankingScale(unit: string): number {
  return unit === 's' ? 1e9 : unit === 'Hz' ? 1e-6 : 1;
}

/** b ranks before a when its least margin is larger (then its next-least, …). */
function byMargins(a: readonly number[], b: readonly number[]): number {
  for (let i = 0; i < Math.max(a.length, b.length); i++) {
    const x = a[i] ?? Infinity,
      y = b[i] ?? Infinity;
    if (x !== y) return y - x > 0 ? 1 : -1;
  }
  return 0;
}

/** A unit as the comparison sees it: through the port map (noise parameters kept only where ports 1 and 2 stay put), at the reference. */
export function prepareUnit(u: UnitData, portMap: readonly number[] | null | undefined, referenceOhms: number): UnitData {
  let network = u.network,
    noise = u.noise ?? null;
  if (portMap) {
    network = selectPorts(network, portMap);
    if (portMap[0] !== 1 || portMap[1] !== 2) noise = null; // noise parameters belong to the file's port 1 → 2 path
  }
  return { ...u, network: renormalize(network, referenceOhms), noise };
}

export function compareCandidates(requirement: NormalizedPart, candidates: readonly Candidate[], referenceOhms: number): CandidateResult[] {
  const out = candidates.map((c): Omit<CandidateResult, 'rank'> => {
    const units = c.units.map((u) => prepareUnit(u, c.portMap, referenceOhms));
    const gaps: Gap[] = [];
    const coveredIndex: number[] = [];
    requirement.checks.forEach((check, i) => {
      const own = units.map((u) => gapOf(u, check)).filter((g): g is Gap => g !== null);
      for (const g of own) if (!gaps.some((x) => x.band === g.band && x.unit === g.unit)) gaps.push(g);
      if (own.length === 0) coveredIndex.push(i);
    });
    const evaluated = evaluatePart({ ...requirement, checks: coveredIndex.map((i) => requirement.checks[i]) }, units);
    const result = evaluated.value;
    const byCheck: Array<CheckResult | null> = requirement.checks.map(() => null);
    if (result) coveredIndex.forEach((ci, k) => (byCheck[ci] = result.results[k]));
    const tightest = byCheck
      .flatMap((r, i) =>
        r && r.kind === 'limit' && r.margin !== null
          ? [{ margin: r.margin, key: r.margin * rankingScale(r.unit), check: i, label: r.label, on: r.on, band: r.band, unit: r.unit }]
          : [],
      )
      .sort((a, b) => a.key - b.key || a.check - b.check);
    const coverage = gaps.length ? 'partial' : 'full';
    const errors = evaluated.errors.map((e) => ({ ...e, ...(c.at && e.line === 0 ? c.at : {}) }));
    return {
      label: c.label,
      coverage,
      gaps,
      result,
      byCheck,
      errors,
      warnings: result?.warnings ?? [],
      pass: coverage === 'full' && result !== null && result.pass,
      margins: tightest.map((t) => t.key),
      tightest,
      units,
    };
  });
  const ranked = out
    .map((c, i) => ({ c, i }))
    .filter((x) => x.c.coverage === 'full' && x.c.result)
    .sort((a, b) => byMargins(a.c.margins, b.c.margins) || a.i - b.i);
  const rankOf = new Map(ranked.map((x, k) => [x.i, k + 1]));
  return out.map((c, i) => ({ ...c, rank: rankOf.get(i) ?? null }));
}

/** The candidates' evaluation errors, each said once: the same mistake of several candidates names them all. */
export function candidateErrors(results: readonly CandidateResult[]): SpecError[] {
  const merged = new Map<string, { error: SpecError; labels: string[] }>();
  for (const c of results) {
    for (const e of c.errors) {
      const key = `${e.file}\u0000${e.line}\u0000${e.column}\u0000${e.message}`;
      const m = merged.get(key);
      if (m) m.labels.push(c.label);
      else merged.set(key, { error: e, labels: [c.label] });
    }
  }
  return [...merged.values()].map(({ error, labels }) => ({
    ...error,
    message: `${labels.length === 1 ? 'candidate' : 'candidates'} ${labels.map((l) => `"${l}"`).join(', ')}: ${error.message}`,
  }));
}

/** The bands of the requirement for which no candidate has any data at all: nothing can be said there. */
export function bandsNoneCover(requirement: NormalizedPart, results: readonly CandidateResult[]): NormalizedCheck['band'][] {
  const out = new Map<string, NormalizedCheck['band']>();
  for (const check of requirement.checks) {
    const nobody = results.every((c) =>
      c.units.every((u) => {
        const g = gapOf(u, check);
        return g !== null && g.coveredFromHz === null;
      }),
    );
    if (nobody) out.set(check.band.name, check.band);
  }
  return [...out.values()];
}
