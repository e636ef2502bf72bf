/** Small statistics over unit results. */

/** The median: the middle value, or the mean of the two middle values for an even count. */
export function median(values: readonly number[]): number {
  if (values.length === 0) return NaN;
  const s = [...values].sort((a, b) => a - b);
  const m = s.length >> 1;
  return s.length % 2 ? s[m] : (s[m - 1] + s[m]) / 2;
}

/** The largest finite-or-not value, by a loop (spreading a data-sized array into Math.max overflows the stack); -Infinity when empty. */
export function largest(values: ArrayLike<number>): number {
  let m = -Infinity;
  for (let i = 0; i < values.length; i++) if (values[i] > m || Number.isNaN(values[i])) m = values[i];
  return m;
}

/** The smallest value, by a loop; Infinity when empty. */
export function smallest(values: ArrayLike<number>): number {
  let m = Infinity;
  for (let i = 0; i < values.length; i++) if (values[i] < m || Number.isNaN(values[i])) m = values[i];
  return m;
}
