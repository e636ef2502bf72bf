/**
 * Change limits (qualification sequences): the same unit measured before and
 * after a stress. For each unit (by serial) that has a measurement at either
 * stage, both must exist; the figure is computed at both, and its change —
 * the value at the later stage minus the value at the earlier one — is taken
 * point by point on the common grid of the two measurements over the band
 * (both grids' points inside the band and its two edges, each trace linear
 * between its own points: evaluate/difference.ts). The unit's worst change,
 * the result's worst, typical, margin and pass follow the rules of every
 * other limit (evaluate.ts).
 */
import type { Position, SpecError } from '../part-file/diagnostics.js';
import type { Change, NormalizedCheck, NormalizedPart } from '../part-file/normalize.js';
import { formatFrequency } from '../format/units.js';
import { differenceTrace } from './difference.js';
import { marginOf, resultOf, type CheckResult, type UnitData, type UnitResult } from './evaluate.js';
import { figureTrace } from './trace.js';

const matches = (u: UnitData, stage: Readonly<Record<string, string>>) => Object.entries(stage).every(([k, v]) => u.conditions[k] === v);
const serialOf = (u: UnitData) => u.serial ?? u.unit;
const stageText = (stage: Readonly<Record<string, string>>) =>
  Object.entries(stage)
    .map(([k, v]) => `${k}: ${v}`)
    .join(', ');

export function evaluateChange(
  part: NormalizedPart,
  check: NormalizedCheck & { change: Change },
  all: readonly UnitData[],
  score: (v: number) => number,
): { value: CheckResult } | { error: SpecError } {
  const fail = (code: SpecError['code'], message: string, at: Position = check.at) => ({ error: { code, file: part.file, message, ...at } });
  const { from, to } = check.change;
  const serials = [...new Set(all.filter((u) => matches(u, from) || matches(u, to)).map(serialOf))];
  if (!serials.length) return fail('unknown-condition', `no measured unit is at either stage of this change (${stageText(from)}; ${stageText(to)})`);
  const results: UnitResult[] = [];
  const later: UnitData[] = [];
  const band = check.band;
  for (const serial of serials) {
    const a = all.filter((u) => serialOf(u) === serial && matches(u, from));
    const b = all.filter((u) => serialOf(u) === serial && matches(u, to));
    if (a.length !== 1 || b.length !== 1) {
      const which =
        a.length === 0
          ? `has no measurement at ${stageText(from)}`
          : b.length === 0
            ? `has no measurement at ${stageText(to)}`
            : `has ${a.length > 1 ? a.length : b.length} measurements at ${stageText(a.length > 1 ? from : to)}`;
      return fail(
        'unknown-condition',
        `unit ${serial} ${which}; a change limit needs each unit measured once at both stages (${stageText(from)} → ${stageText(to)})`,
      );
    }
    let best: { value: number; atHz: number; s: number; on: string } | null = null;
    for (const item of check.items) {
      const ta = figureTrace(part, check.figure, item, a[0], { aperture: check.aperture, nominal: check.nominal, band });
      const tb = figureTrace(part, check.figure, item, b[0], { aperture: check.aperture, nominal: check.nominal, band });
      if (!ta || !tb) return fail('figure-undefined', `${check.figure.id} has no value at every point, which a change limit needs`);
      for (const [t, u] of [
        [ta, a[0]],
        [tb, b[0]],
      ] as const) {
        if (band.fromHz < t.freqHz[0] || band.toHz > t.freqHz[t.freqHz.length - 1]) {
          return fail(
            'band-outside-data',
            `band ${band.name} (${formatFrequency(band.fromHz)} to ${formatFrequency(band.toHz)}) reaches outside the measured range of ${u.file} (${formatFrequency(t.freqHz[0])} to ${formatFrequency(t.freqHz[t.freqHz.length - 1])})`,
            band.at,
          );
        }
      }
      const d = differenceTrace(tb, ta, band.fromHz, band.toHz);
      for (let k = 0; k < d.values.length; k++) {
        const v = d.values[k];
        if (Number.isNaN(v))
          return fail(
            'figure-undefined',
            `the change of ${check.figure.id} on ${item.label} of unit ${serial} has no value at ${formatFrequency(d.freqHz[k])}`,
          );
        const s = score(v);
        if (!best || s < best.s) best = { value: v, atHz: d.freqHz[k], s, on: item.label };
      }
    }
    const w = best as NonNullable<typeof best>;
    const margin = check.limit ? marginOf(check.limit, w.value) : null;
    results.push({ unit: serial, worst: w.value, atHz: w.atHz, worstOn: w.on, margin, pass: margin === null ? null : margin >= 0 });
    later.push(b[0]);
  }
  return { value: resultOf(check, results, later, score, null) };
}
