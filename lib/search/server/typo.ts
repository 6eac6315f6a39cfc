// Meilisearch's typo rules: no typo under `oneTypo` letters (5), one from there,
// two from `twoTypos` (9); a transposition is one typo (Damerau–Levenshtein,
// optimal string alignment); a term whose first letter differs from the query
// word's costs one extra typo. The last query word matches as a prefix.
export interface TypoLimits {
  enabled: boolean;
  oneTypo: number;
  twoTypos: number;
}

export function allowedTypos(word: string, limits: TypoLimits): number {
  if (!limits.enabled) return 0;
  const n = [...word].length;
  return n >= limits.twoTypos ? 2 : n >= limits.oneTypo ? 1 : 0;
}

// OSA distance of `query` to `term`, or in prefix mode to the closest prefix of
// `term`; returns max+1 as soon as the bound is exceeded.
export function osaDistance(query: string, term: string, max: number, prefix: boolean): number {
  const n = query.length;
  const m = prefix ? Math.min(term.length, n + max) : term.length;
  if (!prefix && Math.abs(m - n) > max) return max + 1;
  let prev2 = new Array<number>(n + 1).fill(0);
  let prev = Array.from({ length: n + 1 }, (_, i) => i);
  let best = prev[n];
  for (let j = 1; j <= m; j++) {
    const cur = new Array<number>(n + 1);
    cur[0] = j;
    let rowMin = cur[0];
    const tc = term[j - 1];
    for (let i = 1; i <= n; i++) {
      const qc = query[i - 1];
      let d = Math.min(prev[i] + 1, cur[i - 1] + 1, prev[i - 1] + (qc === tc ? 0 : 1));
      if (i > 1 && j > 1 && qc === term[j - 2] && query[i - 2] === tc) d = Math.min(d, prev2[i - 2] + 1);
      cur[i] = d;
      if (d < rowMin) rowMin = d;
    }
    if (cur[n] < best) best = cur[n];
    if (rowMin > max) return prefix ? (best <= max ? best : max + 1) : max + 1;
    prev2 = prev;
    prev = cur;
  }
  return prefix ? best : prev[n];
}

// Typos a vocabulary term costs for a query word, or null when it does not match.
export function termTypos(word: string, term: string, max: number, prefix: boolean): number | null {
  if (prefix ? term.startsWith(word) : term === word) return 0;
  if (max === 0 || term.length === 0) return null;
  const firstDiffers = term[0] !== word[0];
  const bound = firstDiffers ? max - 1 : max;
  if (bound < 1) return null;
  const d = osaDistance(word, term, bound, prefix);
  if (d > bound) return null;
  return firstDiffers ? d + 1 : d;
}
