/** The part file's measurements (a serial may appear under several conditions) and its typical-at conditions. */
import type { NormalizedMeasurement } from './normalize.js';
import { conditionText, isObj, str, type Context, type Obj } from './context.js';

export function normalizeMeasurements(spec: Obj, { err, at }: Context): { measurements: NormalizedMeasurement[]; typicalAt: Record<string, string> | null } {
  // a serial may appear several times under different conditions (temperature corners)
  const measurements: NormalizedMeasurement[] = [];
  const seen = new Map<string, number>();
  if (Array.isArray(spec.measurements)) {
    spec.measurements.forEach((m, i) => {
      if (!isObj(m) || str(m.unit) === null || typeof m.file !== 'string') return;
      const unit = str(m.unit) as string;
      const conditions: Record<string, string> = {};
      if (isObj(m.conditions)) for (const [k, v] of Object.entries(m.conditions)) conditions[k] = conditionText(v);
      const key = `${unit}\u0000${JSON.stringify(Object.entries(conditions).sort())}`;
      if (seen.has(key))
        err(
          'duplicate',
          `measurements.${i}.unit`,
          `unit ${unit} is listed twice under the same conditions (entries ${(seen.get(key) as number) + 1} and ${i + 1}); list each measurement once`,
        );
      seen.set(key, i);
      measurements.push({
        unit,
        label: unit,
        file: m.file,
        conditions,
        notes: str(m.notes),
        instrument: str(m.instrument),
        calibration: str(m.calibration),
        date: str(m.date),
        operator: str(m.operator),
        lot: str(m.lot),
        at: at(`measurements.${i}`),
        fileAt: at(`measurements.${i}.file`),
      });
    });
  }
  // where a serial repeats, results name the measurement by serial and conditions: "SN3001 @ 85 °C"
  const count = new Map<string, number>();
  for (const m of measurements) count.set(m.unit, (count.get(m.unit) ?? 0) + 1);
  for (const [i, m] of measurements.entries()) {
    const conds = Object.values(m.conditions);
    if ((count.get(m.unit) ?? 0) > 1 && conds.length) measurements[i] = { ...m, label: `${m.unit} @ ${conds.join(', ')}` };
  }

  // the conditions typical values are quoted at
  let typicalAt: Record<string, string> | null = null;
  if (isObj(spec['typical-at'])) {
    typicalAt = {};
    for (const [k, v] of Object.entries(spec['typical-at'])) typicalAt[k] = conditionText(v);
    const wanted = typicalAt;
    if (!measurements.some((m) => Object.entries(wanted).every(([k, v]) => m.conditions[k] === v))) {
      err(
        'unknown-condition',
        'typical-at',
        `no measured unit has the conditions of typical-at (${Object.entries(wanted)
          .map(([k, v]) => `${k}: ${v}`)
          .join(', ')}); typical values must come from measured units`,
      );
    }
  }

  return { measurements, typicalAt };
}
