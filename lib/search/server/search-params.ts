import { errors } from "./errors";

// The search parameters Meilisearch accepts; unknown ones are refused as it does.
export interface SearchParams {
  q?: string | null;
  offset?: number;
  limit?: number;
  page?: number;
  hitsPerPage?: number;
  filter?: unknown;
  facets?: string[];
  sort?: string[];
  attributesToRetrieve?: string[];
  attributesToHighlight?: string[];
  attributesToCrop?: string[];
  highlightPreTag?: string;
  highlightPostTag?: string;
  matchingStrategy?: "last" | "all" | "frequency";
  attributesToSearchOn?: string[] | null;
}

// Accepted so clients sending them are not refused; this server does not act on them.
const IGNORED = ["cropLength", "cropMarker", "showMatchesPosition", "showRankingScore", "showRankingScoreDetails", "rankingScoreThreshold", "distinct", "locales", "retrieveVectors", "hybrid", "vector", "media", "showPerformanceDetails"];
const KNOWN = ["q", "offset", "limit", "page", "hitsPerPage", "filter", "facets", "sort", "attributesToRetrieve", "attributesToHighlight", "attributesToCrop", "highlightPreTag", "highlightPostTag", "matchingStrategy", "attributesToSearchOn", ...IGNORED];

function count(body: Record<string, unknown>, key: string, code: string) {
  const v = body[key];
  if (v === undefined || v === null) return undefined;
  if (typeof v !== "number" || !Number.isInteger(v) || v < 0)
    throw errors.badRequest(`Invalid value type at \`.${key}\`: expected a positive integer, but found ${typeof v}: \`${JSON.stringify(v)}\``, code);
  return v;
}

function strings(body: Record<string, unknown>, key: string, code: string) {
  const v = body[key];
  if (v === undefined || v === null) return undefined;
  if (!Array.isArray(v) || v.some((s) => typeof s !== "string"))
    throw errors.badRequest(`Invalid value type at \`.${key}\`: expected an array of strings, but found: \`${JSON.stringify(v)}\``, code);
  return v as string[];
}

function text(body: Record<string, unknown>, key: string, code: string) {
  const v = body[key];
  if (v === undefined || v === null) return undefined;
  if (typeof v !== "string") throw errors.badRequest(`Invalid value type at \`.${key}\`: expected a string, but found ${typeof v}: \`${JSON.stringify(v)}\``, code);
  return v;
}

export function parseSearchParams(raw: unknown): SearchParams {
  if (!raw || typeof raw !== "object" || Array.isArray(raw)) throw errors.badRequest("Invalid value type: expected an object", "bad_request");
  const body = raw as Record<string, unknown>;
  for (const k of Object.keys(body))
    if (!KNOWN.includes(k)) throw errors.badRequest(`Unknown field \`${k}\`: expected one of ${KNOWN.map((x) => `\`${x}\``).join(", ")}`, "bad_request");
  const strategy = text(body, "matchingStrategy", "invalid_search_matching_strategy");
  if (strategy !== undefined && !["last", "all", "frequency"].includes(strategy))
    throw errors.badRequest(`Unknown value \`${strategy}\` at \`.matchingStrategy\`: expected one of \`last\`, \`all\`, \`frequency\``, "invalid_search_matching_strategy");
  if (body.page !== undefined && body.page !== null && body.page === 0)
    throw errors.badRequest("Invalid value at `.page`: the page number starts at 1", "invalid_search_page");
  return {
    q: text(body, "q", "invalid_search_q"),
    offset: count(body, "offset", "invalid_search_offset"),
    limit: count(body, "limit", "invalid_search_limit"),
    page: count(body, "page", "invalid_search_page"),
    hitsPerPage: count(body, "hitsPerPage", "invalid_search_hits_per_page"),
    filter: body.filter ?? undefined,
    facets: strings(body, "facets", "invalid_search_facets"),
    sort: strings(body, "sort", "invalid_search_sort"),
    attributesToRetrieve: strings(body, "attributesToRetrieve", "invalid_search_attributes_to_retrieve"),
    attributesToHighlight: strings(body, "attributesToHighlight", "invalid_search_attributes_to_highlight"),
    attributesToCrop: strings(body, "attributesToCrop", "invalid_search_attributes_to_crop"),
    highlightPreTag: text(body, "highlightPreTag", "invalid_search_highlight_pre_tag"),
    highlightPostTag: text(body, "highlightPostTag", "invalid_search_highlight_post_tag"),
    matchingStrategy: strategy as SearchParams["matchingStrategy"],
    attributesToSearchOn: strings(body, "attributesToSearchOn", "invalid_search_attributes_to_search_on"),
  };
}

// GET /indexes/{uid}/search takes the same parameters as a query string.
export function searchParamsFromQuery(query: URLSearchParams): Record<string, unknown> {
  const out: Record<string, unknown> = {};
  const lists = ["facets", "sort", "attributesToRetrieve", "attributesToHighlight", "attributesToCrop", "attributesToSearchOn"];
  const numbers = ["offset", "limit", "page", "hitsPerPage", "cropLength"];
  for (const [k, v] of query) {
    if (lists.includes(k)) out[k] = v === "" ? [] : v.split(",");
    else if (numbers.includes(k)) out[k] = /^\d+$/.test(v) ? Number(v) : v;
    else out[k] = v;
  }
  return out;
}
