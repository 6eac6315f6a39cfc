import type { IndexState } from "./index-state";
import type { WordHit } from "./term-index";
import type { QueryWord } from "./tokenize";
import { proximityOf } from "./proximity";
import { allowedTypos } from "./typo";

export interface WordMatch {
  key: string;
  words: number; // query words the document covers (leading ones under "last")
  typos: number;
  rank: number;
  exact: number;
  freq: number;
  proximity: number;
}

type Coverage = (WordHit | undefined)[];

function cover(cov: Map<string, Coverage>, n: number, key: string, from: number, to: number, hit: WordHit) {
  let c = cov.get(key);
  if (!c) cov.set(key, (c = new Array(n).fill(undefined)));
  for (let i = from; i <= to; i++) {
    const h = i === from ? hit : { ...hit, typos: 0 };
    const prev = c[i];
    if (!prev || h.typos < prev.typos || (h.typos === prev.typos && h.rank < prev.rank)) c[i] = h;
  }
}

// Meilisearch's split derivation: a query word read as two adjacent words,
// split where both halves are frequent; it costs one typo.
function splitMatches(index: IndexState, word: string): Map<string, WordHit> {
  const hits = new Map<string, WordHit>();
  let best: [string, string, number] | null = null;
  for (let k = 1; k < word.length; k++) {
    const left = word.slice(0, k);
    const right = word.slice(k);
    const f = Math.min(index.terms.documentFrequency(left), index.terms.documentFrequency(right));
    if (f > 0 && (!best || f > best[2])) best = [left, right, f];
  }
  if (!best) return hits;
  const [left, right] = best;
  const rights = index.terms.occurrences(right);
  const fields = index.searchFields();
  for (const [key, leftFields] of index.terms.occurrences(left)) {
    const shared = leftFields.filter((f) => rights.get(key)?.includes(f));
    for (const field of shared) {
      const tokens = index.tokensOf(key, field);
      if (tokens.some((t, i) => t === left && tokens[i + 1] === right)) {
        hits.set(key, { typos: 1, rank: fields.indexOf(field), exact: false, freq: 1 });
        break;
      }
    }
  }
  return hits;
}

// A quoted phrase: its words in order, next to each other, without typos.
function phraseMatches(index: IndexState, phrase: string[]): Map<string, WordHit> {
  const hits = new Map<string, WordHit>();
  const occ = phrase.map((w) => index.terms.occurrences(w));
  const fields = index.searchFields();
  for (const [key, firstFields] of occ[0]) {
    const shared = firstFields.filter((f) => occ.every((o) => o.get(key)?.includes(f)));
    for (const field of shared) {
      const tokens = index.tokensOf(key, field);
      const at = tokens.findIndex((_, i) => phrase.every((w, k) => tokens[i + k] === w));
      if (at >= 0) {
        hits.set(key, { typos: 0, rank: fields.indexOf(field), exact: true, freq: 1 });
        break;
      }
    }
  }
  return hits;
}

// Documents matching the query words under the matching strategy. A word is
// covered by a term within its typo allowance, by a concatenation of 2 or 3
// consecutive query words (one typo less per extra word), or by its split.
// "all" keeps documents covering every word; "last" (the default) keeps those
// covering the first word and counts the leading words covered, which is what
// dropping words from the end yields; "frequency" keeps any covered word.
export function matchQuery(index: IndexState, words: QueryWord[], strategy: string): WordMatch[] {
  const typo = index.typoSettings();
  const n = words.length;
  const cov = new Map<string, Coverage>();
  words.forEach((w, i) => {
    if (w.phrase) {
      for (const [key, hit] of phraseMatches(index, w.phrase)) cover(cov, n, key, i, i, hit);
      return;
    }
    for (const [key, hit] of index.terms.match(w.word, w.prefix, typo)) cover(cov, n, key, i, i, hit);
    if (allowedTypos(w.word, typo) >= 1) for (const [key, hit] of splitMatches(index, w.word)) cover(cov, n, key, i, i, hit);
    for (let len = 2; len <= 3 && i + len <= n && !words.slice(i, i + len).some((x) => x.phrase); len++) {
      const last = words[i + len - 1];
      const joined = words.slice(i, i + len).map((x) => x.word).join("");
      for (const [key, hit] of index.terms.match(joined, last.prefix, typo, len - 1)) cover(cov, n, key, i, i + len - 1, hit);
    }
  });
  // The terms each word reaches, for the proximity rule's positions (a phrase reaches its own words).
  const reach = words.map((w) => new Set(w.phrase ?? index.terms.candidates(w.word, w.prefix, typo).keys()));
  const out: WordMatch[] = [];
  for (const [key, c] of cov) {
    let covered = 0;
    if (strategy === "frequency") covered = c.filter(Boolean).length;
    else while (covered < n && c[covered]) covered++;
    if (covered === 0 || (strategy === "all" && covered < n)) continue;
    const used = strategy === "frequency" ? c.filter((h): h is WordHit => !!h) : (c.slice(0, covered) as WordHit[]);
    out.push({
      key,
      words: covered,
      typos: used.reduce((s, h) => s + h.typos, 0),
      rank: Math.min(...used.map((h) => h.rank)),
      exact: used.filter((h) => h.exact).length,
      freq: used.reduce((s, h) => s + h.freq, 0),
      proximity: strategy === "frequency" ? 0 : proximityOf(index, key, words, reach, covered),
    });
  }
  return out;
}
