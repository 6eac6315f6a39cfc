import SearchableMap from "minisearch/SearchableMap";
import { searchableText } from "./doc-values";
import { tokenize } from "./tokenize";
import { allowedTypos, termTypos, type TypoLimits } from "./typo";

/** Where a term occurs: attribute → document key → how often. */
type Postings = Map<string, Map<string, number>>;

export interface WordHit {
  typos: number;
  rank: number; // position of the best matching attribute in searchableAttributes
  exact: boolean; // matched the word itself, not a typo or a longer prefix
  freq: number;
}

export interface TypoSettings extends TypoLimits {
  disableOnWords: Set<string>;
  disableOnAttributes: Set<string>;
  disableOnNumbers: boolean;
}

// The inverted index: a radix tree (MiniSearch's public SearchableMap) from each term to its postings, so
// prefix lookups walk one branch; the typo and prefix rules on top are Meilisearch's, not MiniSearch's fuzzy match.
export class TermIndex {
  private postingsOf = new SearchableMap<Postings>();
  private termsOfDoc = new Map<string, Set<string>>(); // what to take out when a document changes
  private rankOf = new Map<string, number>();
  private byFirstLetter: Map<string, string[]> | null = null;
  private candidateCache = new Map<string, Map<string, number>>();

  constructor(readonly fields: string[]) {
    fields.forEach((f, i) => this.rankOf.has(f) || this.rankOf.set(f, i));
  }

  put(key: string, doc: Record<string, unknown>) {
    this.drop(key);
    const terms = new Set<string>();
    for (const field of this.rankOf.keys()) {
      for (const term of tokenize(searchableText(doc, field))) {
        if (!term) continue;
        let postings = this.postingsOf.get(term);
        if (!postings) this.postingsOf.set(term, (postings = new Map()));
        let docs = postings.get(field);
        if (!docs) postings.set(field, (docs = new Map()));
        docs.set(key, (docs.get(key) ?? 0) + 1);
        terms.add(term);
      }
    }
    this.termsOfDoc.set(key, terms);
    this.changed();
  }

  remove(key: string) {
    this.drop(key);
    this.changed();
  }

  private drop(key: string) {
    const terms = this.termsOfDoc.get(key);
    if (!terms) return;
    this.termsOfDoc.delete(key);
    for (const term of terms) {
      const postings = this.postingsOf.get(term);
      if (!postings) continue;
      for (const [field, docs] of postings) if (docs.delete(key) && docs.size === 0) postings.delete(field);
      if (postings.size === 0) this.postingsOf.delete(term);
    }
  }

  private changed() {
    this.byFirstLetter = null;
    this.candidateCache.clear();
  }

  private groups(): Map<string, string[]> {
    if (!this.byFirstLetter) {
      const g = new Map<string, string[]>();
      for (const term of this.postingsOf.keys()) {
        const list = g.get(term[0]);
        if (list) list.push(term);
        else g.set(term[0], [term]);
      }
      this.byFirstLetter = g;
    }
    return this.byFirstLetter;
  }

  // Vocabulary terms a query word reaches, with the typos each costs.
  // `fewer` lowers the allowance: a concatenation of n query words gets n-1 typos less.
  candidates(word: string, prefix: boolean, typo: TypoSettings, fewer = 0): Map<string, number> {
    const cacheKey = `${prefix ? "p" : "w"}${fewer}:${word}`;
    const cached = this.candidateCache.get(cacheKey);
    if (cached) return cached;
    let max = Math.max(0, allowedTypos(word, typo) - fewer);
    if (typo.disableOnWords.has(word) || (typo.disableOnNumbers && /^\d+$/.test(word))) max = 0;
    const out = new Map<string, number>();
    if (max === 0) {
      if (prefix) for (const t of this.postingsOf.atPrefix(word).keys()) out.set(t, 0);
      else if (this.postingsOf.has(word)) out.set(word, 0);
    } else {
      const groups = this.groups();
      const lists = max >= 2 ? [...groups.values()] : [groups.get(word[0]) ?? []];
      for (const list of lists)
        for (const term of list) {
          const t = termTypos(word, term, max, prefix);
          if (t !== null) out.set(term, t);
        }
    }
    if (this.candidateCache.size > 2000) this.candidateCache.clear();
    this.candidateCache.set(cacheKey, out);
    return out;
  }

  // Documents holding any of the word's candidate terms.
  match(word: string, prefix: boolean, typo: TypoSettings, fewer = 0): Map<string, WordHit> {
    const hits = new Map<string, WordHit>();
    for (const [term, typos] of this.candidates(word, prefix, typo, fewer)) {
      const postings = this.postingsOf.get(term);
      if (!postings) continue;
      const exact = term === word;
      for (const [field, docs] of postings) {
        if (typos > 0 && typo.disableOnAttributes.has(field)) continue;
        const rank = this.rankOf.get(field)!;
        for (const [key, freq] of docs) {
          const prev = hits.get(key);
          if (!prev) hits.set(key, { typos, rank, exact, freq });
          else {
            prev.typos = Math.min(prev.typos, typos);
            prev.rank = Math.min(prev.rank, rank);
            prev.exact ||= exact;
            prev.freq += freq;
          }
        }
      }
    }
    return hits;
  }

  // Documents holding the exact term, with the attributes it occurs in.
  occurrences(term: string): Map<string, string[]> {
    const out = new Map<string, string[]>();
    for (const [field, docs] of this.postingsOf.get(term) ?? []) {
      for (const key of docs.keys()) {
        const list = out.get(key);
        if (list) list.push(field);
        else out.set(key, [field]);
      }
    }
    return out;
  }

  documentFrequency(term: string): number {
    let n = 0;
    for (const docs of this.postingsOf.get(term)?.values() ?? []) n = Math.max(n, docs.size);
    return n;
  }
}
