/**
 * What a comparison says in words and against its baseline: one sentence per
 * candidate on why it ranks where it does, and the differences of every
 * candidate from the baseline (per limit, worst minus the baseline's worst;
 * per trace figure and parameter, the difference trace of difference.ts).
 */
import type { Trace } from '../evaluate/trace.js';
import { figureTrace } from '../evaluate/trace.js';
import { bandRange } from '../format/units.js';
import { formatValue } from '../format/values.js';
import type { NormalizedPart } from '../part-file/normalize.js';
import type { CandidateResult, MarginEntry } from './compare.js';
import { differenceTrace, medianTrace } from '../evaluate/difference.js';

const limitName = (t: MarginEntry) => `${t.label.toLowerCase()} ${t.on.join(', ')} over ${t.band}`;
const amount = (v: number, unit: string) => formatValue(Math.abs(v), unit);

/** A candidate's gaps, one per band (the first unit's that lacks data there). */
export const bandGaps = (c: CandidateResult) => [...new Map(c.gaps.map((g) => [g.band, g])).values()];

/** Where a candidate's data leave a band uncovered, in words: "data cover 2.4 GHz to 2.47 GHz of ism (…) only". */
export function gapText(g: CandidateResult['gaps'][number]): string {
  return g.coveredFromHz === null
    ? `no data at all in ${g.band} (${bandRange(g.fromHz, g.toHz)})`
    : `data cover ${bandRange(g.coveredFromHz, g.coveredToHz as number)} of ${g.band} (${bandRange(g.fromHz, g.toHz)}) only`;
}

/** The largest margin of a requirement row over the candidates with a result there, or null when fewer than two have one (then nothing is "best"). */
export function bestMargin(results: readonly CandidateResult[], check: number): number | null {
  const margins = results.flatMap((c) => (c.byCheck[check]?.margin != null ? [c.byCheck[check]?.margin as number] : []));
  return margins.length > 1 ? Math.max(...margins) : null;
}

/** Why each candidate ranks where it does (or is not ranked), one sentence each, in input order. */
export function rankReasons(results: readonly CandidateResult[]): string[] {
  const ranked = results.filter((c) => c.rank !== null).sort((a, b) => (a.rank as number) - (b.rank as number));
  return results.map((c) => {
    const fails = c.byCheck.filter((r) => r && r.kind === 'limit' && r.pass === false).length;
    const failText = fails ? `; it fails ${fails} limit${fails === 1 ? '' : 's'} of the requirement` : '';
    if (c.rank === null) {
      const gaps = bandGaps(c);
      return `${c.label}: not ranked: no data over ${gaps.map((g) => (g.coveredFromHz === null ? `all of ${g.band} (${bandRange(g.fromHz, g.toHz)})` : `${uncovered(g)} of ${g.band}`)).join(', ')}, and nothing is extrapolated`;
    }
    const first = c.tightest[0];
    if (!first) return `${c.label}: ranked ${c.rank}; the requirement has no limit with a margin`;
    if (c.rank === 1) {
      const lead =
        ranked.length > 1
          ? `ranked first: its least margin, ${formatValue(first.margin, first.unit)} on ${limitName(first)}, is the largest of the candidates`
          : 'the only candidate ranked';
      return `${c.label}: ${lead}${failText}`;
    }
    const above = ranked[c.rank - 2];
    let i = 0;
    while (i < c.tightest.length && above.tightest[i] && above.tightest[i].key === c.tightest[i].key) i++;
    const mine = c.tightest[i],
      theirs = above.tightest[i];
    if (!mine || !theirs) return `${c.label}: the same margins as ${above.label}; listed after it as in the comparison file${failText}`;
    const which = i === 0 ? 'tightest limit' : `${ordinal(i + 1)} tightest limit (the tighter ones tie)`;
    if (mine.check === theirs.check) {
      return `${c.label}: ${amount(theirs.margin - mine.margin, mine.unit)} less margin than ${above.label} on ${limitName(mine)}, the ${which} of both (${formatValue(mine.margin, mine.unit)} against ${formatValue(theirs.margin, theirs.unit)})${failText}`;
    }
    const less = mine.unit === theirs.unit ? `${amount(theirs.margin - mine.margin, mine.unit)} less than` : 'less than';
    return `${c.label}: its ${which}, ${limitName(mine)}, leaves ${formatValue(mine.margin, mine.unit)}: ${less} the ${formatValue(theirs.margin, theirs.unit)} ${above.label} leaves on ${limitName(theirs)}${failText}`;
  });
}

function uncovered(g: CandidateResult['gaps'][number]): string {
  const parts: string[] = [];
  if ((g.coveredFromHz as number) > g.fromHz) parts.push(bandRange(g.fromHz, g.coveredFromHz as number));
  if ((g.coveredToHz as number) < g.toHz) parts.push(bandRange(g.coveredToHz as number, g.toHz));
  return parts.join(' and ');
}

function ordinal(n: number): string {
  return ['', 'first', 'second', 'third', 'fourth', 'fifth'][n] ?? `${n}th`;
}

export interface LimitDifference {
  /** The requirement check's index. */
  readonly check: number;
  /** candidate worst − baseline worst, in the figure's unit; null where either has no result. */
  readonly worst: number | null;
}

export interface TraceDifference {
  readonly check: number;
  readonly figure: string;
  readonly item: string;
  readonly band: string;
  readonly unit: string;
  readonly trace: Trace;
}

export interface CandidateDifference {
  readonly label: string;
  readonly limits: readonly LimitDifference[];
  readonly traces: readonly TraceDifference[];
}

/** Each candidate's median trace of a check's item over its units, on its first unit's grid (null when the figure has no per-point values). */
export function candidateTrace(requirement: NormalizedPart, c: CandidateResult, check: number, item: number): Trace | null {
  const ch = requirement.checks[check];
  const traces = c.units.flatMap((u) => {
    const t = figureTrace(requirement, ch.figure, ch.items[item], u, { aperture: ch.aperture, nominal: ch.nominal, band: ch.band });
    return t ? [t] : [];
  });
  return traces.length ? medianTrace(traces) : null;
}

/** Every candidate but the baseline against the baseline: worst differences per limit and difference traces of trace figures over their bands. */
export function baselineDifferences(requirement: NormalizedPart, results: readonly CandidateResult[], baseline: string): CandidateDifference[] {
  const base = results.find((c) => c.label === baseline);
  if (!base) return [];
  const seen = new Set<string>();
  const traceChecks = requirement.checks.flatMap((ch, i) => {
    if (ch.figure.shape !== 'trace' || !ch.figure.perPoint) return [];
    return ch.items.flatMap((it, j) => {
      const key = `${ch.figure.id} ${it.label} ${ch.band.name}`;
      if (seen.has(key)) return [];
      seen.add(key);
      return [{ check: i, item: j }];
    });
  });
  const baseTraces = traceChecks.map((t) => candidateTrace(requirement, base, t.check, t.item));
  return results
    .filter((c) => c !== base)
    .map((c) => ({
      label: c.label,
      limits: requirement.checks.map((_, i) => {
        const a = c.byCheck[i],
          b = base.byCheck[i];
        return { check: i, worst: a && b ? a.worst - b.worst : null };
      }),
      traces: traceChecks.flatMap((t, k) => {
        const mine = candidateTrace(requirement, c, t.check, t.item),
          theirs = baseTraces[k];
        if (!mine || !theirs) return [];
        const ch = requirement.checks[t.check];
        const trace = differenceTrace(mine, theirs, ch.band.fromHz, ch.band.toHz);
        return trace.freqHz.length
          ? [{ check: t.check, figure: ch.figure.id, item: ch.items[t.item].label, band: ch.band.name, unit: ch.figure.unit, trace }]
          : [];
      }),
    }));
}
