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
    const strings = new Map<string, { label: string; n: number }>();
    const numbers = new Map<number, { label: string; n: number }>();
    let min = Infinity;
    let max = -Infinity;
    for (const flat of flats) {
      const v = flat.get(facet);
      if (!v) continue;
      for (const s of v.stringList) {
        const c = strings.get(s);
        if (c) c.n++;
        else strings.set(s, { label: v.originals.get(s) ?? s, n: 1 });
      }
      const nums = v.numbers.length > 1 ? new Set(v.numbers) : v.numbers;
      for (const n of nums) {
        const c = numbers.get(n);
        if (c) c.n++;
        else numbers.set(n, { label: String(n), n: 1 });
        if (n < min) min = n;
        if (n > max) max = n;
      }
    }
    const byCount = (settings.faceting.sortFacetValuesBy[facet] ?? settings.faceting.sortFacetValuesBy["*"]) === "count";
    const entries = [...strings.values(), ...numbers.values()].sort((a, b) => (byCount && b.n !== a.n ? b.n - a.n : a.label < b.label ? -1 : a.label > b.label ? 1 : 0));
    facetDistribution[facet] = Object.fromEntries(entries.slice(0, settings.faceting.maxValuesPerFacet).map((e) => [e.label, e.n]));
    if (min <= max) facetStats[facet] = { min, max };
  }
  return { facetDistribution, facetStats };
}
