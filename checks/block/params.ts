import { isMap, isScalar, isSeq, type Node, type YAMLMap } from "yaml";
import { MEASURES } from "../script/measure-specs";
import { readQuantity } from "../units";
import type { BlockError, ParamSpec } from "./types";

// Names the script gives its own meaning; a parameter may shadow a unit but not these.
export const RESERVED = new Set([
  "check", "near", "tran", "ac", "op", "dc", "noise", "tf", "eseries", "montecarlo", "sweep", ...Object.keys(MEASURES),
]);
const IDENT = /^[A-Za-z_][A-Za-z0-9_]*$/;
// A negative or zero part value is a typo, and ngspice would simulate it without complaint.
const POSITIVE: Record<string, string> = { ohm: "a resistance", F: "a capacitance", H: "an inductance" };
const PARAM_KEYS = new Set(["name", "value", "tol", "dist", "note"]);

/** Why a resistance, capacitance or inductance value is refused, or null. */
export function notPositive(name: string, value: string, q: { si: number; unit: string }): string | null {
  return POSITIVE[q.unit] && !(q.si > 0) ? `parameter "${name}": ${POSITIVE[q.unit]} must be positive, not ${value}` : null;
}

export type Tolerance = { kind: "rel"; rel: number } | { kind: "abs"; abs: number };

/** "1%" is relative; "0.25 V" is absolute in the value's unit. */
export function readTolerance(tol: string, unit: string): Tolerance {
  const s = tol.trim();
  const pct = /^\+?(\d+\.?\d*|\.\d+)\s*%$/.exec(s);
  if (pct) {
    const rel = Number(pct[1]) / 100;
    if (!(rel > 0 && rel < 1)) throw new Error(`tolerance "${tol}" must lie between 0% and 100%`);
    return { kind: "rel", rel };
  }
  if (/^[+-]|±/.test(s)) throw new Error(`tolerance "${tol}" is written without a sign; it applies both ways`);
  const q = readQuantity(s);
  if (q.unit !== unit)
    throw new Error(`tolerance "${tol}" is in ${q.unit || "plain numbers"}, the value in ${unit || "plain numbers"}; use a percentage or the value's unit`);
  if (!(q.si > 0)) throw new Error(`tolerance "${tol}" must be greater than zero`);
  return { kind: "abs", abs: q.si };
}

/** Validate the `params` list; one error per mistake, each with its file line. */
/** Parameters per block (checks/README.md, limits). */
export const MAX_PARAMS = 200;

export function readParams(node: Node | null | undefined, lineOf: (n: Node | null | undefined) => number, errors: BlockError[]): ParamSpec[] {
  if (node == null) return [];
  if (!isSeq(node)) {
    errors.push({ message: "params must be a list of { name, value, tol?, note? }", line: lineOf(node) });
    return [];
  }
  // Each parameter multiplies the corner and sensitivity work: a block is a circuit block, not a data file.
  if (node.items.length > MAX_PARAMS) {
    errors.push({ message: `at most ${MAX_PARAMS} parameters per block (this one has ${node.items.length})`, line: lineOf(node) });
    return [];
  }
  const out: ParamSpec[] = [];
  const seen = new Map<string, string>();
  for (const item of node.items as Node[]) {
    const line = lineOf(item);
    if (!isMap(item)) {
      errors.push({ message: "each parameter must be a map { name, value, tol?, note? }", line });
      continue;
    }
    const map = item as YAMLMap;
    for (const p of map.items) {
      const k = isScalar(p.key) ? String(p.key.value) : "";
      if (!PARAM_KEYS.has(k)) errors.push({ message: `unknown parameter key "${k}" (use name, value, tol, dist, note)`, line: lineOf(p.key as Node) });
    }
    const str = (k: string) => {
      const v = map.get(k, true) as Node | undefined;
      return v === undefined || v === null ? undefined : isScalar(v) && v.value !== null ? String(v.value) : undefined;
    };
    const name = str("name");
    const value = str("value");
    if (!name) {
      errors.push({ message: "a parameter has no name", line });
      continue;
    }
    if (!IDENT.test(name)) {
      errors.push({ message: `parameter name "${name}" is not an identifier (letters, digits, _; not starting with a digit)`, line });
      continue;
    }
    if (RESERVED.has(name)) errors.push({ message: `parameter name "${name}" is taken by a script built-in`, line });
    const folded = name.toLowerCase();
    const earlier = seen.get(folded);
    if (earlier === name) errors.push({ message: `duplicate parameter name "${name}"`, line });
    else if (earlier) errors.push({ message: `parameters "${earlier}" and "${name}" differ only in case (SPICE ignores case)`, line });
    seen.set(folded, earlier ?? name);
    if (value === undefined) {
      errors.push({ message: `parameter "${name}" has no value`, line });
      continue;
    }
    let si: number, unit: string;
    try {
      ({ si, unit } = readQuantity(value));
    } catch (e) {
      errors.push({ message: `parameter "${name}": ${(e as Error).message}`, line: lineOf(map.get("value", true) as Node) });
      continue;
    }
    const negative = notPositive(name, value, { si, unit });
    if (negative) {
      errors.push({ message: negative, line: lineOf(map.get("value", true) as Node) });
      continue;
    }
    const spec: ParamSpec = { name, value, si, unit, line };
    const tol = str("tol");
    if (map.has("tol")) {
      if (tol === undefined) errors.push({ message: `parameter "${name}": tol is empty`, line });
      else
        try {
          readTolerance(tol, unit);
          spec.tol = tol;
        } catch (e) {
          errors.push({ message: `parameter "${name}": ${(e as Error).message}`, line: lineOf(map.get("tol", true) as Node) });
        }
    }
    const dist = str("dist");
    if (dist === "normal" || dist === "uniform") spec.dist = dist;
    else if (map.has("dist")) errors.push({ message: `parameter "${name}": dist is normal or uniform, not "${dist ?? ""}"`, line });
    const note = str("note");
    if (note !== undefined) spec.note = note;
    out.push(spec);
  }
  return out;
}
