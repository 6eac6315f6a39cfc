import type { FlatDoc } from "./doc-values";
import type { IndexSettings } from "./settings";

export interface FacetResult {
  facetDistribution: Record<string, Record<string, number>>;
  facetStats: Record<string, { min: number; max: number }>;
}

// Counts, for each requested facet, the matching documents holding each value;
// a document counts once per value. Keys keep the first spelling seen, numbers
// print as JSON numbers would.
export function computeFacets(facets: string[], flats: FlatDoc[], settings: IndexSettings): FacetResult {
  const facetDistribution: FacetResult["facetDistribution"] = {};
  const facetStats: FacetResult["facetStats"] = {};
  for (const facet of facets) {
    const counts = new Map<string, { label: string; n: number }>();
    let min = Infinity;
    let max = -Infinity;
    for (const flat of flats) {
      const v = flat.get(facet);
      if (!v) continue;
      for (const s of v.strings) bump(counts, `s:${s}`, v.originals.get(s) ?? s);
      for (const n of new Set(v.numbers)) {
        bump(counts, `n:${n}`, String(n));
        if (n < min) min = n;
        if (n > max) max = n;
      }
    }
    const byCount = (settings.faceting.sortFacetValuesBy[facet] ?? settings.faceting.sortFacetValuesBy["*"]) === "count";
    const entries = [...counts.values()].sort((a, b) => (byCount && b.n !== a.n ? b.n - a.n : a.label < b.label ? -1 : a.label > b.label ? 1 : 0));
    facetDistribution[facet] = Object.fromEntries(entries.slice(0, settings.faceting.maxValuesPerFacet).map((e) => [e.label, e.n]));
    if (min <= max) facetStats[facet] = { min, max };
  }
  return { facetDistribution, facetStats };
}

function bump(counts: Map<string, { label: string; n: number }>, key: string, label: string) {
  const c = counts.get(key);
  if (c) c.n++;
  else counts.set(key, { label, n: 1 });
}
