import type { FlatDoc } from "./doc-values";
import type { IndexState } from "./index-state";

export interface Candidate {
  key: string;
  seq: number;
  words: number;
  typos: number;
  rank: number;
  exact: number;
  freq: number;
  proximity: number;
  sortKeys?: SortKey[];
}

type SortKey = [number, number | string];

// Numbers sort before strings, documents without the attribute come last.
function sortKeyOf(f: FlatDoc, attr: string, desc: boolean): SortKey {
  const v = f.get(attr);
  if (v && v.numbers.length) return [0, desc ? Math.max(...v.numbers) : Math.min(...v.numbers)];
  if (v && v.strings.size) {
    const s = [...v.strings].sort();
    return [1, desc ? s[s.length - 1] : s[0]];
  }
  return [2, 0];
}

function compareKeys(a: SortKey, b: SortKey, desc: boolean): number {
  if (a[0] !== b[0]) return a[0] - b[0];
  if (a[0] === 2 || a[1] === b[1]) return 0;
  return (a[1] < b[1] ? -1 : 1) * (desc ? -1 : 1);
}

type Step = (a: Candidate, b: Candidate) => number;

// The ranking rules as comparison steps; sort keys are worked out once per
// candidate. Rules that cannot separate placeholder hits are left out.
export function rankingSteps(index: IndexState, sort: { attr: string; desc: boolean }[], candidates: Candidate[], placeholder: boolean): Step[] {
  const steps: Step[] = [];
  const specs: { attr: string; desc: boolean }[] = [];
  const sortStep = (from: number, to: number): Step => (a, b) => {
    for (let i = from; i < to; i++) {
      const d = compareKeys(a.sortKeys![i], b.sortKeys![i], specs[i].desc);
      if (d) return d;
    }
    return 0;
  };
  for (const rule of index.settings.rankingRules) {
    if (rule === "words" && !placeholder) steps.push((a, b) => b.words - a.words);
    else if (rule === "typo" && !placeholder) steps.push((a, b) => a.typos - b.typos);
    else if (rule === "proximity" && !placeholder) steps.push((a, b) => a.proximity - b.proximity);
    else if (rule === "attribute" && !placeholder) steps.push((a, b) => a.rank - b.rank);
    else if (rule === "exactness" && !placeholder) steps.push((a, b) => b.exact - a.exact);
    else if (rule === "sort" && sort.length) {
      steps.push(sortStep(specs.length, specs.length + sort.length));
      specs.push(...sort);
    } else {
      const custom = /^(.+):(asc|desc)$/.exec(rule);
      if (custom) {
        steps.push(sortStep(specs.length, specs.length + 1));
        specs.push({ attr: custom[1], desc: custom[2] === "desc" });
      }
    }
  }
  if (specs.length) for (const c of candidates) c.sortKeys = specs.map((s) => sortKeyOf(index.flats.get(c.key)!, s.attr, s.desc));
  if (!placeholder) steps.push((a, b) => b.freq - a.freq);
  steps.push((a, b) => a.seq - b.seq);
  return steps;
}

// The first k candidates in rank order, without sorting the rest: a page of 20
// out of thousands of matches costs n·log k comparisons, not n·log n.
export function firstRanked<T>(items: T[], k: number, cmp: (a: T, b: T) => number): T[] {
  if (k <= 0) return [];
  if (k >= items.length / 4) return [...items].sort(cmp).slice(0, k);
  const top: T[] = [];
  for (const item of items) {
    if (top.length === k && cmp(item, top[k - 1]) >= 0) continue;
    let lo = 0;
    let hi = top.length;
    while (lo < hi) {
      const mid = (lo + hi) >> 1;
      if (cmp(top[mid], item) <= 0) lo = mid + 1;
      else hi = mid;
    }
    top.splice(lo, 0, item);
    if (top.length > k) top.pop();
  }
  return top;
}
