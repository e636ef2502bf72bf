/** The result of a part as `scatterbook figures --json` prints it: exactly the documented keys, in order. */
import type { PartResult } from './evaluate.js';

/**
 * A number as the JSON carries it: finite numbers as they are; ±∞ (the VSWR
 * of a total reflection, a margin against it) as the strings "Infinity" and
 * "-Infinity", which JSON can carry and JSON.stringify would turn into null.
 */
export type JsonNumber = number | 'Infinity' | '-Infinity' | null;
export function jsonNumber(v: number | null): JsonNumber {
  if (v === null || Number.isFinite(v)) return v;
  return v > 0 ? 'Infinity' : v < 0 ? '-Infinity' : null;
}

const limitJson = (l: PartResult['results'][number]['limit']) =>
  l ? Object.fromEntries(Object.entries(l).map(([k, v]) => [k, jsonNumber(v as number)])) : null;

/** The JSON of `figures --json`: exactly the documented keys. */
export function figuresJson(r: PartResult): object {
  return {
    part: r.part,
    revision: r.revision,
    pass: r.pass,
    results: r.results.map((c) => ({
      figure: c.figure,
      on: c.on,
      band: c.band,
      fromHz: c.fromHz,
      toHz: c.toHz,
      unit: c.unit,
      limit: limitJson(c.limit),
      worst: jsonNumber(c.worst),
      worstAtHz: c.worstAtHz,
      worstUnit: c.worstUnit,
      worstOn: c.worstOn,
      typical: jsonNumber(c.typical),
      typicalUnit: c.typicalUnit,
      margin: jsonNumber(c.margin),
      pass: c.pass,
      units: c.units.map((u) => ({ unit: u.unit, worst: jsonNumber(u.worst), atHz: u.atHz, margin: jsonNumber(u.margin), pass: u.pass })),
      ...(c.change ? { change: { from: c.change.from, to: c.change.to } } : {}),
    })),
    warnings: r.warnings.map((w) => ({ code: w.code, file: w.file, line: w.line, column: w.column, message: w.message })),
  };
}
