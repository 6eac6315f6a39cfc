import { errors } from "./errors";
import { compileFilter } from "./filter-eval";
import { filterAttributes, parseFilter } from "./filter-parser";
import { formatValue } from "./highlight";
import type { Doc, IndexState } from "./index-state";
import type { SearchParams } from "./search-params";
import { covers } from "./settings";
import { queryWords, wordsWithConcatenations } from "./tokenize";
import { matchQuery } from "./query-match";
import { firstRanked, rankingSteps, type Candidate } from "./ranking";


function listAttrs(list: string[]) {
  return list.map((a) => `\`${a}\``).join(", ");
}

export function checkFilterable(index: IndexState, attrs: string[], src: string) {
  const filterable = index.settings.filterableAttributes;
  for (const attr of attrs) {
    if (covers(filterable, attr)) continue;
    const available = filterable.length
      ? `Available filterable attribute patterns are: ${listAttrs(filterable)}.`
      : "This index does not have configured filterable attributes.";
    throw errors.invalidFilter(`Index \`${index.uid}\`: Attribute \`${attr}\` is not filterable. ${available}\n${src}`);
  }
}

export function filterPredicate(index: IndexState, filter: unknown) {
  const node = parseFilter(filter);
  if (!node) return null;
  checkFilterable(index, filterAttributes(node), typeof filter === "string" ? filter : JSON.stringify(filter));
  return compileFilter(node);
}

function parseSort(index: IndexState, sort: string[]) {
  return sort.map((s) => {
    const m = /^(.+):(asc|desc)$/.exec(s);
    if (!m) throw errors.badRequest(`Invalid syntax for the sort parameter: expected expression ending by \`:asc\` or \`:desc\`, found \`${s}\`.`, "invalid_search_sort");
    if (!covers(index.settings.sortableAttributes, m[1])) {
      const available = index.settings.sortableAttributes.length ? `Available sortable attributes are: ${listAttrs(index.settings.sortableAttributes)}.` : "This index does not have configured sortable attributes.";
      throw errors.badRequest(`Attribute \`${m[1]}\` is not sortable. ${available}`, "invalid_search_sort");
    }
    return { attr: m[1], desc: m[2] === "desc" };
  });
}

function matchWords(index: IndexState, q: string, strategy: string): Candidate[] | null {
  const words = queryWords(q);
  if (words.length === 0) return null;
  const seqOf = index.positions();
  return matchQuery(index, words, strategy).flatMap((m) => {
    const s = seqOf.get(m.key);
    return s === undefined ? [] : [{ ...m, seq: s }];
  });
}

export function executeSearch(index: IndexState, p: SearchParams) {
  const started = performance.now();
  const predicate = filterPredicate(index, p.filter);
  const filterable = index.settings.filterableAttributes;
  const facets = p.facets?.includes("*") ? filterable.filter((f) => f !== "*") : p.facets ?? [];
  for (const f of facets)
    if (!covers(filterable, f))
      throw errors.badRequest(`Invalid facet distribution: Attribute \`${f}\` is not filterable. The available filterable attributes are ${filterable.length ? listAttrs(filterable) : "none"}.`, "invalid_search_facets");
  const sort = parseSort(index, p.sort ?? []);
  const q = p.q ?? "";

  let candidates = matchWords(index, q, p.matchingStrategy ?? "last");
  if (candidates === null) {
    candidates = [];
    let seq = 0;
    for (const key of index.docs.keys()) candidates.push({ key, seq: seq++, words: 0, typos: 0, rank: 0, exact: 0, freq: 0, proximity: 0 });
  }
  if (predicate) candidates = candidates.filter((c) => predicate(index.flats.get(c.key)!));

  const steps = rankingSteps(index, sort, candidates, q.trim() === "" || queryWords(q).length === 0);
  const cmp = (a: Candidate, b: Candidate): number => {
    for (const step of steps) {
      const d = step(a, b);
      if (d) return d;
    }
    return 0;
  };
  const maxTotal = index.settings.pagination.maxTotalHits;
  const paged = p.page !== undefined || p.hitsPerPage !== undefined;
  const hitsPerPage = p.hitsPerPage ?? 20;
  const page = p.page ?? 1;
  const offset = paged ? (page - 1) * hitsPerPage : p.offset ?? 0;
  const limit = paged ? hitsPerPage : p.limit ?? 20;
  const total = Math.min(candidates.length, maxTotal);
  const ranked = firstRanked(candidates, Math.min(offset + limit, total), cmp);
  const window = ranked.slice(Math.min(offset, total), Math.min(offset + limit, total));

  const facetResult = facets.length ? index.facets.count(facets, candidates.map((c) => index.flats.get(c.key)!), index.settings) : null;
  const hits = window.map((c) => formatHit(index, index.docs.get(c.key)!, p, q));
  const processingTimeMs = Math.round(performance.now() - started);
  const pageInfo = paged
    ? { hitsPerPage, page, totalPages: hitsPerPage ? Math.ceil(total / hitsPerPage) : 0, totalHits: total }
    : { limit, offset, estimatedTotalHits: total };
  return { hits, query: q, processingTimeMs, ...pageInfo, ...(facetResult ?? {}) };
}

export function projectDocument(index: IndexState, doc: Doc, fields: string[] | undefined): Doc {
  const displayed = index.settings.displayedAttributes;
  const wanted = fields && fields.length ? fields : ["*"];
  const out: Doc = {};
  for (const [k, v] of Object.entries(doc)) if (covers(displayed, k) && covers(wanted, k)) out[k] = v;
  return out;
}

function formatHit(index: IndexState, doc: Doc, p: SearchParams, q: string): Doc {
  const hit = projectDocument(index, doc, p.attributesToRetrieve);
  const toHighlight = p.attributesToHighlight ?? [];
  if (toHighlight.length === 0 && (p.attributesToCrop ?? []).length === 0) return hit;
  const typo = index.typoSettings();
  const options = { words: wordsWithConcatenations(queryWords(q)), limits: typo, pre: p.highlightPreTag ?? "<em>", post: p.highlightPostTag ?? "</em>" };
  const formatted: Doc = {};
  for (const [k, v] of Object.entries(hit)) formatted[k] = formatValue(v, covers(toHighlight, k), options);
  return { ...hit, _formatted: formatted };
}
