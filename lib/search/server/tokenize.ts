// Word splitting close to Meilisearch's Latin-script tokenizer: runs of letters
// and digits are words, everything else separates; words compare lowercased
// with diacritics removed.
const WORD = /[\p{L}\p{N}]+/gu;
const MARKS = /\p{M}+/gu;

export interface Token {
  text: string; // the word as written
  norm: string; // lowercased, without diacritics
  start: number; // UTF-16 offsets into the source string
  end: number;
}

export function normalize(word: string): string {
  return word.normalize("NFD").replace(MARKS, "").toLowerCase();
}

export function tokenizeWithOffsets(text: string): Token[] {
  const tokens: Token[] = [];
  for (const m of text.matchAll(WORD)) {
    const start = m.index ?? 0;
    tokens.push({ text: m[0], norm: normalize(m[0]), start, end: start + m[0].length });
  }
  return tokens;
}

export function tokenize(text: string): string[] {
  const out: string[] = [];
  for (const m of text.matchAll(WORD)) out.push(normalize(m[0]));
  return out;
}

export interface QueryWord {
  word: string;
  prefix: boolean;
  fewerTypos?: number; // a concatenation of n query words allows n-1 typos less
}

// The last word is searched as a prefix unless the query ends with a separator
// (Meilisearch: "prefix search on the last word"); like Meilisearch, only the
// first ten words of a query count.
export function queryWords(q: string): QueryWord[] {
  const all = tokenize(q);
  const words = all.slice(0, 10);
  const endsInWord = all.length <= 10 && /[\p{L}\p{N}]$/u.test(q);
  return words.map((word, i) => ({ word, prefix: i === words.length - 1 && endsInWord }));
}

// The query words plus the concatenations of 2 and 3 consecutive ones, which
// Meilisearch also searches ("sallen key" finds "sallenkey").
export function wordsWithConcatenations(words: QueryWord[]): QueryWord[] {
  const out = [...words];
  for (let i = 0; i < words.length; i++)
    for (let len = 2; len <= 3 && i + len <= words.length; len++)
      out.push({ word: words.slice(i, i + len).map((w) => w.word).join(""), prefix: words[i + len - 1].prefix, fewerTypos: len - 1 });
  return out;
}
