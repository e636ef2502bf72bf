/** "Did you mean …?": the nearest known word to a misspelt one. */

export function editDistance(a: string, b: string): number {
  const d = Array.from({ length: a.length + 1 }, (_, i) => [i, ...Array(b.length).fill(0)] as number[]);
  for (let j = 1; j <= b.length; j++) d[0][j] = j;
  for (let i = 1; i <= a.length; i++) {
    for (let j = 1; j <= b.length; j++) {
      d[i][j] = Math.min(d[i - 1][j] + 1, d[i][j - 1] + 1, d[i - 1][j - 1] + (a[i - 1] === b[j - 1] ? 0 : 1));
    }
  }
  return d[a.length][b.length];
}

/**
 * The candidate closest to `word`, if it is close enough to be a likely typo
 * (a small edit distance), or a shortening or lengthening of it ("maximum" → "max").
 */
export function nearest(word: string, candidates: Iterable<string>): string | null {
  const list = [...candidates];
  const w = word.toLowerCase();
  if (w.length >= 3) {
    const related = list.filter((c) => c.length >= 3 && (w.startsWith(c.toLowerCase()) || c.toLowerCase().startsWith(w)));
    if (related.length === 1) return related[0];
  }
  return nearestByEdits(word, list);
}

function nearestByEdits(word: string, candidates: readonly string[]): string | null {
  let best: string | null = null;
  let bestD = Infinity;
  for (const c of candidates) {
    const d = editDistance(word.toLowerCase(), c.toLowerCase());
    if (d < bestD) {
      bestD = d;
      best = c;
    }
  }
  return best !== null && bestD <= Math.max(2, Math.floor(word.length / 3)) ? best : null;
}
