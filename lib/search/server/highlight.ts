import { tokenizeWithOffsets, type QueryWord } from "./tokenize";
import { allowedTypos, termTypos, type TypoLimits } from "./typo";

export interface HighlightOptions {
  words: QueryWord[];
  limits: TypoLimits;
  pre: string;
  post: string;
}

// Wraps each word that matches a query word (same typo and prefix rules as the
// search) in the pre/post tags; a prefix match marks only the typed prefix.
export function highlightText(text: string, o: HighlightOptions): string {
  if (o.words.length === 0) return text;
  let out = "";
  let last = 0;
  for (const tok of tokenizeWithOffsets(text)) {
    let len = 0;
    for (const w of o.words) {
      const typos = termTypos(w.word, tok.norm, Math.max(0, allowedTypos(w.word, o.limits) - (w.fewerTypos ?? 0)), w.prefix);
      if (typos === null) continue;
      const partial = w.prefix && tok.norm !== w.word && tok.norm.startsWith(w.word) && tok.text.length === tok.norm.length;
      len = Math.max(len, partial ? w.word.length : tok.text.length);
    }
    if (len === 0) continue;
    out += text.slice(last, tok.start) + o.pre + text.slice(tok.start, tok.start + len) + o.post;
    last = tok.start + len;
  }
  return out + text.slice(last);
}

// Meilisearch's `_formatted`: highlighted attributes have their strings marked
// and their numbers turned into strings; the others are copied unchanged.
export function formatValue(value: unknown, highlighted: boolean, o: HighlightOptions): unknown {
  if (!highlighted) return value;
  if (typeof value === "string") return highlightText(value, o);
  if (typeof value === "number") return highlightText(String(value), o);
  if (Array.isArray(value)) return value.map((v) => formatValue(v, true, o));
  if (value && typeof value === "object")
    return Object.fromEntries(Object.entries(value).map(([k, v]) => [k, formatValue(v, true, o)]));
  return value;
}
