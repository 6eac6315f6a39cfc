import { errors } from "./errors";

// The index settings Meilisearch returns from GET /indexes/{uid}/settings, with
// its defaults. Settings this server stores but does not act on are listed in
// the report (synonyms, stop words, distinct attribute, proximity precision).
export interface IndexSettings {
  displayedAttributes: string[];
  searchableAttributes: string[];
  filterableAttributes: string[];
  sortableAttributes: string[];
  rankingRules: string[];
  stopWords: string[];
  nonSeparatorTokens: string[];
  separatorTokens: string[];
  dictionary: string[];
  synonyms: Record<string, string[]>;
  distinctAttribute: string | null;
  proximityPrecision: string;
  typoTolerance: {
    enabled: boolean;
    minWordSizeForTypos: { oneTypo: number; twoTypos: number };
    disableOnWords: string[];
    disableOnAttributes: string[];
    disableOnNumbers: boolean;
  };
  faceting: { maxValuesPerFacet: number; sortFacetValuesBy: Record<string, "alpha" | "count"> };
  pagination: { maxTotalHits: number };
  searchCutoffMs: number | null;
  localizedAttributes: unknown[] | null;
  facetSearch: boolean;
  prefixSearch: string;
}

export function defaultSettings(): IndexSettings {
  return {
    displayedAttributes: ["*"],
    searchableAttributes: ["*"],
    filterableAttributes: [],
    sortableAttributes: [],
    rankingRules: ["words", "typo", "proximity", "attribute", "sort", "exactness"],
    stopWords: [],
    nonSeparatorTokens: [],
    separatorTokens: [],
    dictionary: [],
    synonyms: {},
    distinctAttribute: null,
    proximityPrecision: "byWord",
    typoTolerance: {
      enabled: true,
      minWordSizeForTypos: { oneTypo: 5, twoTypos: 9 },
      disableOnWords: [],
      disableOnAttributes: [],
      disableOnNumbers: false,
    },
    faceting: { maxValuesPerFacet: 100, sortFacetValuesBy: { "*": "alpha" } },
    pagination: { maxTotalHits: 1000 },
    searchCutoffMs: null,
    localizedAttributes: null,
    facetSearch: true,
    prefixSearch: "indexingTime",
  };
}

// URL segment of each per-setting route → settings key.
export const settingRoutes: Record<string, keyof IndexSettings> = {
  "displayed-attributes": "displayedAttributes",
  "searchable-attributes": "searchableAttributes",
  "filterable-attributes": "filterableAttributes",
  "sortable-attributes": "sortableAttributes",
  "ranking-rules": "rankingRules",
  "stop-words": "stopWords",
  "non-separator-tokens": "nonSeparatorTokens",
  "separator-tokens": "separatorTokens",
  dictionary: "dictionary",
  synonyms: "synonyms",
  "distinct-attribute": "distinctAttribute",
  "proximity-precision": "proximityPrecision",
  "typo-tolerance": "typoTolerance",
  faceting: "faceting",
  pagination: "pagination",
  "search-cutoff-ms": "searchCutoffMs",
  "localized-attributes": "localizedAttributes",
  "facet-search": "facetSearch",
  "prefix-search": "prefixSearch",
};

const STRING_LISTS = new Set<keyof IndexSettings>([
  "displayedAttributes", "searchableAttributes", "filterableAttributes", "sortableAttributes",
  "rankingRules", "stopWords", "nonSeparatorTokens", "separatorTokens", "dictionary",
]);
const NESTED = new Set<keyof IndexSettings>(["typoTolerance", "faceting", "pagination"]);

function snake(key: string): string {
  return key.replace(/[A-Z]/g, (c) => `_${c.toLowerCase()}`);
}

// filterableAttributes also accepts Meilisearch's object form
// { attributePatterns: [...] }; this server keeps the attribute names.
function stringList(key: keyof IndexSettings, value: unknown): string[] {
  if (!Array.isArray(value)) throw errors.badRequest(`Invalid value type at \`.${key}\`: expected an array, but found ${typeof value}: \`${JSON.stringify(value)}\``, `invalid_settings_${snake(key)}`);
  return value.flatMap((v) => {
    if (typeof v === "string") return [v];
    if (key === "filterableAttributes" && v && typeof v === "object" && Array.isArray((v as { attributePatterns?: unknown }).attributePatterns))
      return (v as { attributePatterns: unknown[] }).attributePatterns.map(String);
    throw errors.badRequest(`Invalid value type at \`.${key}\`: expected a string, but found \`${JSON.stringify(v)}\``, `invalid_settings_${snake(key)}`);
  });
}

// Applies a PATCH body; a null value resets that setting to its default.
export function applySettings(current: IndexSettings, patch: Record<string, unknown>): IndexSettings {
  const next = structuredClone(current) as unknown as Record<string, unknown>;
  const defaults = defaultSettings() as unknown as Record<string, unknown>;
  for (const [k, value] of Object.entries(patch)) {
    const key = k as keyof IndexSettings;
    if (!(key in defaults)) throw errors.badRequest(`Unknown field \`${k}\`: expected one of ${Object.keys(defaults).map((d) => `\`${d}\``).join(", ")}`);
    if (value === null) next[key] = structuredClone(defaults[key]);
    else if (STRING_LISTS.has(key)) next[key] = [...new Set(stringList(key, value))];
    else if (NESTED.has(key)) {
      if (typeof value !== "object" || Array.isArray(value)) throw errors.badRequest(`Invalid value type at \`.${key}\`: expected an object`, `invalid_settings_${snake(key)}`);
      next[key] = mergeNested(next[key] as Record<string, unknown>, value as Record<string, unknown>, defaults[key] as Record<string, unknown>);
    } else next[key] = value;
  }
  const s = next as unknown as IndexSettings;
  if (s.filterableAttributes) s.filterableAttributes.sort();
  if (s.sortableAttributes) s.sortableAttributes.sort();
  return s;
}

function mergeNested(cur: Record<string, unknown>, patch: Record<string, unknown>, defaults: Record<string, unknown>) {
  const out = { ...cur };
  for (const [k, v] of Object.entries(patch)) {
    if (v === null) out[k] = structuredClone(defaults[k]);
    else if (v && typeof v === "object" && !Array.isArray(v) && defaults[k] && typeof defaults[k] === "object" && !Array.isArray(defaults[k]))
      out[k] = { ...(cur[k] as object), ...(v as object) };
    else out[k] = v;
  }
  return out;
}

// True when `path` (a.b.c) is covered by one of the declared attributes
// (a declared "a" covers "a.b"); "*" covers everything.
export function covers(declared: string[], path: string): boolean {
  return declared.some((d) => d === "*" || d === path || path.startsWith(`${d}.`));
}
