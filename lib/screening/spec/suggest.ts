/** "Did you mean …?" suggestions for misspelt keys, classes and names. */

/** Optimal string alignment distance (Levenshtein with adjacent transpositions). */
export function editDistance(a: string, b: string): number {
  const m = a.length;
  const n = b.length;
  const d: number[][] = Array.from({ length: m + 1 }, (_, i) => {
    const row = new Array<number>(n + 1).fill(0);
    row[0] = i;
    return row;
  });
  for (let j = 0; j <= n; j++) d[0][j] = j;
  for (let i = 1; i <= m; i++) {
    for (let j = 1; j <= n; j++) {
      const cost = a[i - 1] === b[j - 1] ? 0 : 1;
      d[i][j] = Math.min(d[i - 1][j] + 1, d[i][j - 1] + 1, d[i - 1][j - 1] + cost);
      if (i > 1 && j > 1 && a[i - 1] === b[j - 2] && a[i - 2] === b[j - 1]) d[i][j] = Math.min(d[i][j], d[i - 2][j - 2] + 1);
    }
  }
  return d[m][n];
}

/** The closest candidate if it is close enough to be a likely typo, else null. */
export function closest(word: string, candidates: readonly string[]): string | null {
  const w = word.toLowerCase();
  let best: string | null = null;
  let bestDistance = Infinity;
  for (const c of candidates) {
    const dist = editDistance(w, c.toLowerCase());
    if (dist < bestDistance) {
      best = c;
      bestDistance = dist;
    }
  }
  if (best === null || w.length > 64) return null;
  const allowed = Math.max(1, Math.floor(Math.max(w.length, best.length) / 3));
  return bestDistance <= allowed ? best : null;
}

/** " (did you mean 'x'?)" or "". */
export function didYouMean(word: string, candidates: readonly string[]): string {
  const c = closest(word, candidates);
  return c !== null && c !== word ? ` (did you mean '${c}'?)` : "";
}
