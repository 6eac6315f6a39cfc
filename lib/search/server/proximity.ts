import type { IndexState } from "./index-state";
import type { QueryWord } from "./tokenize";

// Meilisearch's "proximity" rule: documents whose query words sit close together, in the query's order, first
// (https://www.meilisearch.com/docs/learn/relevancy/ranking_rules, rule 3). Per pair of consecutive query words the
// cost is their distance in one attribute, one more when reversed, capped at 7; words found only in different
// attributes cost 8 (the caps are from memory of Meilisearch's engine, not from that page).
const PAIR_MAX = 7;
const APART = 8;

/** Positions of each query word's reachable terms, per searchable attribute of one document. */
function positionsOf(index: IndexState, key: string, terms: Set<string>[]): Map<string, number[][]> {
  const out = new Map<string, number[][]>();
  for (const field of index.searchFields()) {
    const tokens = index.tokensOf(key, field);
    if (!tokens.length) continue;
    const at = terms.map(() => [] as number[]);
    tokens.forEach((t, i) => terms.forEach((set, w) => set.has(t) && at[w].push(i)));
    out.set(field, at);
  }
  return out;
}

function pairCost(a: number[], b: number[]): number {
  let best = APART;
  for (const i of a)
    for (const j of b) {
      const d = j > i ? j - i : i - j + 1;
      if (d < best) best = d;
    }
  return Math.min(best, APART);
}

/**
 * The summed distance of the first `covered` query words in a document; lower ranks higher. A word matched only
 * through a concatenation or a split has no position of its own and counts as next to its neighbour.
 */
export function proximityOf(index: IndexState, key: string, words: QueryWord[], terms: Set<string>[], covered: number): number {
  if (covered < 2) return 0;
  const byField = positionsOf(index, key, terms.slice(0, covered));
  let total = 0;
  for (let w = 0; w + 1 < covered; w++) {
    if (words[w].phrase || words[w + 1].phrase) { total += 1; continue; }
    let best = APART;
    let seenA = false;
    let seenB = false;
    for (const at of byField.values()) {
      seenA ||= at[w].length > 0;
      seenB ||= at[w + 1].length > 0;
      if (at[w].length && at[w + 1].length) best = Math.min(best, Math.min(pairCost(at[w], at[w + 1]), PAIR_MAX));
    }
    total += seenA && seenB ? best : 1;
  }
  return total;
}
