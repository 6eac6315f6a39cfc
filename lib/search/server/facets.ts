import type { FlatDoc, PathValues } from "./doc-values";
import type { IndexSettings } from "./settings";

export interface FacetResult {
  facetDistribution: Record<string, Record<string, number>>;
  facetStats: Record<string, { min: number; max: number }>;
}

// The values one attribute has taken, numbered, so counting facets is array
// arithmetic instead of string hashing. Labels keep the first spelling seen;
// numbers print as JSON numbers would.
class FacetValues {
  private byKey = new Map<string, number>();
  readonly labels: string[] = [];
  readonly numbers: (number | null)[] = [];

  private id(key: string, label: string, num: number | null): number {
    let id = this.byKey.get(key);
    if (id === undefined) {
      id = this.labels.length;
      this.byKey.set(key, id);
      this.labels.push(label);
      this.numbers.push(num);
    }
    return id;
  }

  // Kept on the document's values, which are replaced whenever it changes.
  idsOf(v: PathValues): number[] {
    if (v.facetIds) return v.facetIds;
    const ids = v.stringList.map((s) => this.id(`s:${s}`, v.originals.get(s) ?? s, null));
    for (const n of new Set(v.numbers)) ids.push(this.id(`n:${n}`, String(n), n));
    return (v.facetIds = ids);
  }
}

export class FacetCounter {
  private values = new Map<string, FacetValues>();

  // Counts, for each requested facet, the matching documents holding each
  // value; a document counts once per value.
  count(facets: string[], flats: FlatDoc[], settings: IndexSettings): FacetResult {
    const facetDistribution: FacetResult["facetDistribution"] = {};
    const facetStats: FacetResult["facetStats"] = {};
    for (const facet of facets) {
      let dict = this.values.get(facet);
      if (!dict) this.values.set(facet, (dict = new FacetValues()));
      let counts = new Int32Array(dict.labels.length + 64);
      for (const flat of flats) {
        const v = flat.get(facet);
        if (!v) continue;
        for (const id of dict.idsOf(v)) {
          if (id >= counts.length) {
            const grown = new Int32Array(id * 2 + 64);
            grown.set(counts);
            counts = grown;
          }
          counts[id]++;
        }
      }
      let min = Infinity;
      let max = -Infinity;
      const entries: { label: string; n: number }[] = [];
      counts.forEach((n, id) => {
        if (!n) return;
        entries.push({ label: dict.labels[id], n });
        const num = dict.numbers[id];
        if (num !== null) {
          if (num < min) min = num;
          if (num > max) max = num;
        }
      });
      const byCount = (settings.faceting.sortFacetValuesBy[facet] ?? settings.faceting.sortFacetValuesBy["*"]) === "count";
      entries.sort((a, b) => (byCount && b.n !== a.n ? b.n - a.n : a.label < b.label ? -1 : a.label > b.label ? 1 : 0));
      facetDistribution[facet] = Object.fromEntries(entries.slice(0, settings.faceting.maxValuesPerFacet).map((e) => [e.label, e.n]));
      if (min <= max) facetStats[facet] = { min, max };
    }
    return { facetDistribution, facetStats };
  }
}
