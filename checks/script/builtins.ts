import type { Unit } from "mathjs";
import { eseries } from "../eseries";
import { formatValue, fromQuantity, toQuantity } from "../units";
import { nearTest } from "./condition";
import { isUnit, math } from "./math";

export type Analysis =
  | { kind: "tran"; stop: number; step: number; uic?: boolean }
  | { kind: "ac"; f1: number; f2: number; perDecade: number }
  | { kind: "op" };

/** A simulation result as the script holds it; only measures look inside. */
export class SimHandle {
  constructor(readonly analysis: Analysis, readonly result: unknown, readonly index: number) {}
  toString() {
    return `[${this.analysis.kind} result]`;
  }
}

export type SimHooks = {
  simulate: (analysis: Analysis) => { result: unknown; index: number };
  measure: (name: string, result: unknown, node: string, args: (number | string)[]) => number;
  window: (index: number, w: { node: string; from: number; to: number; measure: string; value?: number }) => void;
  mark: (index: number, m: { node: string; x: number; label: string; value?: number }) => void;
};

/** A number in SI from a script argument that should carry `unit` (a bare number is read as SI). */
function inUnit(x: unknown, unit: string, what: string): number {
  if (typeof x === "number") return x;
  if (isUnit(x)) {
    const q = toQuantity(x)!;
    if (q.unit === unit) return q.si;
    throw new Error(`${what} must be in ${unit}, got ${formatValue(x)}`);
  }
  throw new Error(`${what} must be a quantity in ${unit}, got ${formatValue(x)}`);
}

// The same label as the plot's own -3 dB mark, so a measured corner is drawn once.
const F3DB_LABEL = "−3 dB";

// What each measure reads after (res, node) and the unit of its result.
const MEASURES: Record<string, { args: [string, string][]; unit: string; analysis: Analysis["kind"] }> = {
  peak: { args: [["from", "s"], ["to", "s"]], unit: "V", analysis: "tran" },
  trough: { args: [["from", "s"], ["to", "s"]], unit: "V", analysis: "tran" },
  pp: { args: [["from", "s"], ["to", "s"]], unit: "V", analysis: "tran" },
  rms: { args: [["from", "s"], ["to", "s"]], unit: "V", analysis: "tran" },
  avg: { args: [["from", "s"], ["to", "s"]], unit: "V", analysis: "tran" },
  freq: { args: [["from", "s"], ["to", "s"]], unit: "Hz", analysis: "tran" },
  thd: { args: [["from", "s"], ["to", "s"]], unit: "", analysis: "tran" },
  at: { args: [["t", "s"]], unit: "V", analysis: "tran" },
  startup: { args: [["level", "V"]], unit: "s", analysis: "tran" },
  gain_db: { args: [["f", "Hz"]], unit: "dB", analysis: "ac" },
  phase: { args: [["f", "Hz"]], unit: "deg", analysis: "ac" },
  f3db: { args: [], unit: "Hz", analysis: "ac" },
  v: { args: [], unit: "V", analysis: "op" },
  i: { args: [], unit: "A", analysis: "op" },
};

// Why a measure gave NaN (nothing to measure), collected while a statement runs; evaluate.ts
// takes them after each statement and puts them in the detail of every check that reads them.
let reasons: string[] = [];
export function takeReasons(): string[] {
  const out = reasons;
  reasons = [];
  return out;
}

/** A measure's value, or NaN with its reason kept when the result holds nothing to measure. */
function measured(hooks: SimHooks, name: string, result: unknown, node: string, args: (number | string)[]): number {
  try {
    return hooks.measure(name, result, node, args);
  } catch (e) {
    if ((e as Error).name !== "NothingToMeasure") throw e;
    reasons.push(`${name}(): ${(e as Error).message}`);
    return NaN;
  }
}

export function builtins(hooks: SimHooks): Map<string, unknown> {
  const fns = new Map<string, unknown>();
  fns.set("near", (x: unknown, t: unknown, tol: unknown) => nearTest(x, t, tol).ok);
  fns.set("eseries", (x: unknown, series: unknown) => {
    if (typeof series !== "string") throw new Error('eseries(x, "E24"): the series is a string');
    const q = toQuantity(x);
    if (!q) throw new Error(`eseries(): ${formatValue(x)} is not a number or quantity`);
    return fromQuantity(eseries(q.si, series), q.unit);
  });
  fns.set("tran", (stop: unknown, step: unknown, flag?: unknown) => {
    if (flag !== undefined && flag !== "uic") throw new Error('tran(stop, step, "uic"): the third argument can only be "uic"');
    const a: Analysis = { kind: "tran", stop: inUnit(stop, "s", "tran() stop"), step: inUnit(step, "s", "tran() step") };
    if (flag === "uic") a.uic = true;
    const { result, index } = hooks.simulate(a);
    return new SimHandle(a, result, index);
  });
  fns.set("ac", (f1: unknown, f2: unknown, perDecade: unknown) => {
    const n = perDecade;
    if (typeof n !== "number" || !Number.isInteger(n) || n < 1) throw new Error("ac(f1, f2, points_per_decade): points per decade is a whole number");
    const a: Analysis = { kind: "ac", f1: inUnit(f1, "Hz", "ac() f1"), f2: inUnit(f2, "Hz", "ac() f2"), perDecade: n };
    const { result, index } = hooks.simulate(a);
    return new SimHandle(a, result, index);
  });
  fns.set("op", () => {
    const a: Analysis = { kind: "op" };
    const { result, index } = hooks.simulate(a);
    return new SimHandle(a, result, index);
  });
  for (const [name, spec] of Object.entries(MEASURES)) {
    fns.set(name, (res: unknown, node: unknown, ...rest: unknown[]) => {
      const call = `${name}(res, node${spec.args.map(([a]) => `, ${a}`).join("")})`;
      if (!(res instanceof SimHandle)) throw new Error(`${call}: the first argument must be a simulation result`);
      if (res.analysis.kind !== spec.analysis) throw new Error(`${call} needs a ${spec.analysis}() result, got ${res.analysis.kind}()`);
      if (typeof node !== "string") throw new Error(`${call}: the node is a string such as "out"`);
      if (name === "f3db") {
        // Optional edge for a band-pass: f3db(res, node, "lower" | "upper").
        if (rest.length > 1 || (rest.length === 1 && rest[0] !== "lower" && rest[0] !== "upper"))
          throw new Error('f3db(res, node) or f3db(res, node, "lower" | "upper")');
        const value = hooks.measure(name, res.result, node, rest as string[]);
        hooks.mark(res.index, { node, x: value, label: F3DB_LABEL });
        return math.unit(value, "Hz") as Unit;
      }
      if (rest.length !== spec.args.length) throw new Error(`${call} takes ${spec.args.length + 2} arguments`);
      const args = spec.args.map(([a, unit], k) => inUnit(rest[k], unit, `${name}() ${a}`));
      const value = measured(hooks, name, res.result, node, args);
      if (spec.args[0]?.[0] === "from") hooks.window(res.index, { node, from: args[0], to: args[1], measure: name, value });
      if (name === "gain_db" || name === "phase") hooks.mark(res.index, { node, x: args[0], label: name === "gain_db" ? "gain" : "phase", value });
      if (name === "startup" && Number.isFinite(value)) hooks.mark(res.index, { node, x: value, label: "start-up" });
      return spec.unit ? (math.unit(value, spec.unit) as Unit) : value;
    });
  }
  return fns;
}
