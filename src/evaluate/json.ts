/** The result of a part as `scatterbook figures --json` prints it: exactly the documented keys, in order. */
import type { PartResult } from './evaluate.js';

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
      limit: c.limit,
      worst: c.worst,
      worstAtHz: c.worstAtHz,
      worstUnit: c.worstUnit,
      worstOn: c.worstOn,
      typical: c.typical,
      margin: c.margin,
      pass: c.pass,
      units: c.units.map((u) => ({ unit: u.unit, worst: u.worst, atHz: u.atHz, margin: u.margin, pass: u.pass })),
    })),
  };
}

