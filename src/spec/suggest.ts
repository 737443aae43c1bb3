// "Did you mean …" for misspelt keys and values, by edit distance.

/**
 * Optimal-string-alignment distance: Levenshtein (insert, delete, substitute) plus swapping two
 * neighbouring letters, each costing 1, so "opne" is one step from "open".
 */
export function editDistance(a: string, b: string): number {
  const rows: number[][] = [Array.from({ length: b.length + 1 }, (_, j) => j)];
  for (let i = 1; i <= a.length; i++) {
    const row = [i];
    for (let j = 1; j <= b.length; j++) {
      const cost = a[i - 1] === b[j - 1] ? 0 : 1;
      let d = Math.min((rows[i - 1]?.[j] ?? 0) + 1, (row[j - 1] ?? 0) + 1, (rows[i - 1]?.[j - 1] ?? 0) + cost);
      if (i > 1 && j > 1 && a[i - 1] === b[j - 2] && a[i - 2] === b[j - 1]) d = Math.min(d, (rows[i - 2]?.[j - 2] ?? 0) + 1);
      row.push(d);
    }
    rows.push(row);
  }
  return rows[a.length]?.[b.length] ?? 0;
}

// Compare without case, underscores, hyphens or spaces, so lineZ0 and line-z0 find line_z0.
const folded = (s: string): string => s.toLowerCase().replace(/[_\-\s]/g, '');

/** The closest candidate if it is close enough to be a likely typo, else undefined. */
export function closest(word: string, candidates: readonly string[]): string | undefined {
  const w = folded(word);
  let best: string | undefined;
  let bestDistance = Infinity;
  for (const c of candidates) {
    const d = editDistance(w, folded(c));
    if (d < bestDistance) {
      best = c;
      bestDistance = d;
    }
  }
  const allowed = Math.max(1, Math.floor(Math.max(w.length, best?.length ?? 0) / 3));
  return bestDistance <= allowed ? best : undefined;
}

/** "did you mean x?" or "allowed: a, b, c". */
export function suggestion(word: string, candidates: readonly string[]): string {
  const near = closest(word, candidates);
  return near === undefined ? `allowed: ${candidates.join(', ')}` : `did you mean ${near}?`;
}
