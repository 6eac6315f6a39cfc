import { normalize } from "./tokenize";

// A document's values by dotted path, precomputed once per write so filters,
// facets and sorting never walk the JSON again.
export interface PathValues {
  strings: Set<string>; // normalized strings (booleans as "true"/"false")
  stringList: string[]; // the same, as an array: faster to walk when counting facets
  originals: Map<string, string>; // normalized → first spelling seen, for facet keys
  numbers: number[];
  hasNull: boolean;
  hasEmpty: boolean; // "", [] or {}
  facetIds?: number[]; // numbered values, filled in when first counted as a facet
}

export type FlatDoc = Map<string, PathValues>;

function slot(flat: FlatDoc, path: string): PathValues {
  let v = flat.get(path);
  if (!v) {
    v = { strings: new Set(), stringList: [], originals: new Map(), numbers: [], hasNull: false, hasEmpty: false };
    flat.set(path, v);
  }
  return v;
}

function addString(v: PathValues, s: string) {
  const n = normalize(s);
  if (!v.strings.has(n)) v.stringList.push(n);
  v.strings.add(n);
  if (!v.originals.has(n)) v.originals.set(n, s);
}

function walk(value: unknown, path: string, flat: FlatDoc) {
  if (Array.isArray(value)) {
    const v = slot(flat, path);
    if (value.length === 0) v.hasEmpty = true;
    for (const el of value) walk(el, path, flat);
  } else if (value !== null && typeof value === "object") {
    const entries = Object.entries(value);
    const v = slot(flat, path);
    if (entries.length === 0) v.hasEmpty = true;
    for (const [k, el] of entries) walk(el, `${path}.${k}`, flat);
  } else {
    const v = slot(flat, path);
    if (value === null) v.hasNull = true;
    else if (typeof value === "number") v.numbers.push(value);
    else if (typeof value === "boolean") addString(v, String(value));
    else if (typeof value === "string") {
      if (value === "") v.hasEmpty = true;
      addString(v, value);
    }
  }
}

export function flatten(doc: Record<string, unknown>): FlatDoc {
  const flat: FlatDoc = new Map();
  for (const [k, v] of Object.entries(doc)) walk(v, k, flat);
  return flat;
}

// Text of every string and number under a searchable attribute (a declared
// "params" covers "params.name"), in document order.
export function searchableText(doc: Record<string, unknown>, attr: string): string {
  const parts: string[] = [];
  const visit = (value: unknown) => {
    if (Array.isArray(value)) value.forEach(visit);
    else if (value !== null && typeof value === "object") Object.values(value).forEach(visit);
    else if (typeof value === "string" || typeof value === "number") parts.push(String(value));
  };
  visit(getPath(doc, attr));
  return parts.join("\n");
}

export function getPath(doc: unknown, path: string): unknown {
  if (doc && typeof doc === "object" && path in (doc as object)) return (doc as Record<string, unknown>)[path];
  const dot = path.indexOf(".");
  if (dot < 0 || !doc || typeof doc !== "object") return undefined;
  // Meilisearch flattens nested objects: "a.b" reaches { a: { b } } and each element of { a: [{ b }] }.
  const head = (doc as Record<string, unknown>)[path.slice(0, dot)];
  const rest = path.slice(dot + 1);
  if (Array.isArray(head)) {
    const vals = head.map((el) => getPath(el, rest)).filter((v) => v !== undefined);
    return vals.length ? vals : undefined;
  }
  return getPath(head, rest);
}
