import type { Condition, FilterNode } from "./filter-parser";
import type { FlatDoc, PathValues } from "./doc-values";
import { normalize } from "./tokenize";

export type DocPredicate = (flat: FlatDoc) => boolean;

const NUMBER = /^[+-]?(\d+(\.\d*)?|\.\d+)([eE][+-]?\d+)?$/;
const asNumber = (s: string) => (NUMBER.test(s) ? Number(s) : null);

// String values compare case-insensitively; a value that reads as a number also
// matches numeric values; an array attribute matches when any element does.
function equals(v: PathValues | undefined, norm: string, num: number | null): boolean {
  if (!v) return false;
  if (v.strings.has(norm)) return true;
  return num !== null && v.numbers.includes(num);
}

function compare(v: PathValues | undefined, op: string, num: number | null, target: string): boolean {
  if (!v) return false;
  const test = (cmp: number) => (op === ">" ? cmp > 0 : op === ">=" ? cmp >= 0 : op === "<" ? cmp < 0 : cmp <= 0);
  if (num !== null) return v.numbers.some((n) => test(n - num));
  for (const s of v.strings) if (test(s < target ? -1 : s > target ? 1 : 0)) return true;
  return false;
}

function condition(c: Condition): DocPredicate {
  switch (c.op) {
    case "=": {
      const num = asNumber(c.value);
      const norm = normalize(c.value);
      return (f) => equals(f.get(c.attr), norm, num);
    }
    case "!=": {
      const num = asNumber(c.value);
      const norm = normalize(c.value);
      return (f) => !equals(f.get(c.attr), norm, num);
    }
    case ">": case ">=": case "<": case "<=": {
      const num = asNumber(c.value);
      const target = normalize(c.value);
      return (f) => compare(f.get(c.attr), c.op, num, target);
    }
    case "TO": {
      const range = [asNumber(c.from), asNumber(c.to), normalize(c.from), normalize(c.to)] as const;
      return (f) => inOneValue(f.get(c.attr), range);
    }
    case "IN": {
      const norms = c.values.map(normalize);
      const nums = c.values.map(asNumber);
      return (f) => {
        const pv = f.get(c.attr);
        if (!pv) return false;
        for (let i = 0; i < norms.length; i++) if (equals(pv, norms[i], nums[i])) return true;
        return false;
      };
    }
    case "EXISTS":
      return (f) => f.has(c.attr);
    case "NULL":
      return (f) => f.get(c.attr)?.hasNull ?? false;
    case "EMPTY":
      return (f) => f.get(c.attr)?.hasEmpty ?? false;
  }
}

// `a 1 TO 5` needs one value inside the range, not one above 1 and another below 5.
function inOneValue(v: PathValues | undefined, [lo, hi, a, b]: readonly [number | null, number | null, string, string]): boolean {
  if (!v) return false;
  if (lo !== null && hi !== null) return v.numbers.some((n) => n >= lo && n <= hi);
  for (const s of v.strings) if (s >= a && s <= b) return true;
  return false;
}

export function compileFilter(node: FilterNode): DocPredicate {
  switch (node.kind) {
    case "cond":
      return condition(node.cond);
    case "not": {
      const inner = compileFilter(node.node);
      return (f) => !inner(f);
    }
    case "and": {
      const parts = node.nodes.map(compileFilter);
      return (f) => {
        for (const p of parts) if (!p(f)) return false;
        return true;
      };
    }
    case "or": {
      const parts = node.nodes.map(compileFilter);
      return (f) => {
        for (const p of parts) if (p(f)) return true;
        return false;
      };
    }
  }
}
