import MiniSearch from "minisearch";
import { searchableText } from "./doc-values";
import { tokenize } from "./tokenize";
import { allowedTypos, termTypos, type TypoLimits } from "./typo";

export interface IndexedDoc {
  key: string;
  doc: Record<string, unknown>;
}

// MiniSearch keeps the inverted index (a radix tree of terms → fields →
// documents); this subclass reads its vocabulary and postings so the typo and
// prefix rules can be Meilisearch's rather than MiniSearch's own fuzzy match.
class MiniSearchIndex extends MiniSearch<IndexedDoc> {
  vocabulary(): IterableIterator<string> {
    return this._index.keys();
  }
  withPrefix(prefix: string): IterableIterator<string> {
    return this._index.atPrefix(prefix).keys();
  }
  postings(term: string): Map<number, Map<number, number>> | undefined {
    return this._index.get(term);
  }
  externalKey(shortId: number): string | undefined {
    return this._documentIds.get(shortId);
  }
  fieldIds(): Record<string, number> {
    return this._fieldIds;
  }
}

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

export class TermIndex {
  private mini: MiniSearchIndex;
  private fieldRank: string[] = [];
  private rankById: number[] = [];
  private byFirstLetter: Map<string, string[]> | null = null;
  private candidateCache = new Map<string, Map<string, number>>();

  constructor(readonly fields: string[]) {
    this.mini = new MiniSearchIndex({
      fields: fields.length ? fields : ["\u0000none"],
      idField: "key",
      extractField: (d, field) => (field === "key" ? d.key : searchableText(d.doc, field)),
      tokenize,
      processTerm: (t) => t,
    });
    for (const [name, id] of Object.entries(this.mini.fieldIds())) {
      this.fieldRank[id] = name;
      this.rankById[id] = fields.indexOf(name);
    }
  }

  put(key: string, doc: Record<string, unknown>) {
    if (this.mini.has(key)) this.mini.discard(key);
    this.mini.add({ key, doc });
    this.changed();
  }

  remove(key: string) {
    if (this.mini.has(key)) this.mini.discard(key);
    this.changed();
  }

  private changed() {
    this.byFirstLetter = null;
    this.candidateCache.clear();
  }

  private groups(): Map<string, string[]> {
    if (!this.byFirstLetter) {
      const g = new Map<string, string[]>();
      for (const term of this.mini.vocabulary()) {
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
      if (prefix) for (const t of this.mini.withPrefix(word)) out.set(t, 0);
      else if (this.mini.postings(word)) out.set(word, 0);
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
      const postings = this.mini.postings(term);
      if (!postings) continue;
      for (const [fieldId, docs] of postings) {
        const field = this.fieldRank[fieldId];
        if (typos > 0 && typo.disableOnAttributes.has(field)) continue;
        const rank = this.rankById[fieldId];
        for (const [shortId, freq] of docs) {
          const key = this.mini.externalKey(shortId);
          if (key === undefined) continue;
          const exact = term === word;
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
    for (const [fieldId, docs] of this.mini.postings(term) ?? []) {
      for (const shortId of docs.keys()) {
        const key = this.mini.externalKey(shortId);
        if (key === undefined) continue;
        const list = out.get(key);
        if (list) list.push(this.fieldRank[fieldId]);
        else out.set(key, [this.fieldRank[fieldId]]);
      }
    }
    return out;
  }

  documentFrequency(term: string): number {
    let n = 0;
    for (const docs of this.mini.postings(term)?.values() ?? []) n = Math.max(n, docs.size);
    return n;
  }
}
