// Word splitting close to Meilisearch's Latin-script tokenizer (Unicode word
// boundaries, UAX #29): runs of letters and digits are words, and so are
// numbers with inner points or commas ("3.3", "1,000", "v2.1"); everything else
// separates. Words compare lowercased with diacritics removed.
const WORD = /[\p{L}\p{N}]*\p{N}(?:[.,]\p{N}+)+[\p{L}\p{N}]*|[\p{L}\p{N}]+/gu;
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
  phrase?: string[]; // a "quoted phrase": these words, next to each other, exactly
}

// The last word is searched as a prefix unless the query ends with a separator
// (Meilisearch: "prefix search on the last word"); text in double quotes is a
// phrase; like Meilisearch, only the first ten terms of a query count.
export function queryWords(q: string): QueryWord[] {
  const terms: QueryWord[] = [];
  const parts = q.split('"');
  parts.forEach((part, i) => {
    const words = tokenize(part);
    if (i % 2 === 1) {
      if (words.length) terms.push({ word: words.join(" "), prefix: false, phrase: words });
    } else for (const word of words) terms.push({ word, prefix: false });
  });
  const kept = terms.slice(0, 10);
  const last = kept[kept.length - 1];
  if (last && !last.phrase && kept.length === terms.length && /[\p{L}\p{N}]$/u.test(q)) last.prefix = true;
  return kept;
}

// The query words plus the concatenations of 2 and 3 consecutive ones, which
// Meilisearch also searches ("sallen key" finds "sallenkey").
export function wordsWithConcatenations(words: QueryWord[]): QueryWord[] {
  const out = words.flatMap((w) => (w.phrase ? w.phrase.map((word) => ({ word, prefix: false, fewerTypos: 9 })) : [w]));
  for (let i = 0; i < words.length; i++)
    for (let len = 2; len <= 3 && i + len <= words.length && !words.slice(i, i + len).some((w) => w.phrase); len++)
      out.push({ word: words.slice(i, i + len).map((w) => w.word).join(""), prefix: words[i + len - 1].prefix, fewerTypos: len - 1 });
  return out;
}
