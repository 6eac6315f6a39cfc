import type { Unit } from "mathjs";
import { eseries } from "../eseries";
import { formatValue, fromQuantity, toQuantity } from "../units";
import { nearTest } from "./condition";
import { isUnit, math } from "./math";
import { Family, familyValue, makeSweep, SWEPT_ANALYSES, SweepSpec } from "./sweep";
import { MEASURES, unitIn, type Context } from "./measure-specs";
import type { Analysis } from "../spice/types";

export type { Analysis } from "../spice/types";

/** A simulation result as the script holds it; only measures look inside. */
export class SimHandle {
  constructor(readonly analysis: Analysis, readonly result: unknown, readonly index: number) {}
  toString() {
    return `[${this.analysis.kind} result]`;
  }
}

export type SimHooks = {
  simulate: (analysis: Analysis) => { result: unknown; index: number };
  /** One number, or one per member when `result` is a swept family. */
  measure: (name: string, result: unknown, node: string, args: (number | string)[]) => number | number[];
  window: (index: number, w: { node: string; from: number; to: number; measure: string; value?: number }) => void;
  mark: (index: number, m: { node: string; x: number; label: string; value?: number }) => void;
  /** Each parameter's unit, so sweep() can check its values. */
  units?: Map<string, string>;
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

// Why a measure gave NaN (nothing to measure), collected while a statement runs; evaluate.ts
// takes them after each statement and puts them in the detail of every check that reads them.
let reasons: string[] = [];
export function takeReasons(): string[] {
  const out = reasons;
  reasons = [];
  return out;
}

/** A measure's value, or NaN with its reason kept when the result holds nothing to measure. */
function measured(hooks: SimHooks, name: string, result: unknown, node: string, args: (number | string)[]): number | number[] {
  try {
    return hooks.measure(name, result, node, args);
  } catch (e) {
    if ((e as Error).name !== "NothingToMeasure") throw e;
    reasons.push(`${name}(): ${(e as Error).message}`);
    return NaN;
  }
}

// Optional edge for a band-pass: f3db(res, node, "lower" | "upper").
function f3dbOf(hooks: SimHooks, res: SimHandle, node: string, rest: unknown[]): Unit {
  if (rest.length > 1 || (rest.length === 1 && rest[0] !== "lower" && rest[0] !== "upper"))
    throw new Error('f3db(res, node) or f3db(res, node, "lower" | "upper")');
  const value = hooks.measure("f3db", res.result, node, rest as string[]);
  if (Array.isArray(value)) return familyValue(value, "Hz", res.result as Family) as Unit;
  hooks.mark(res.index, { node, x: value, label: F3DB_LABEL });
  return math.unit(value, "Hz") as Unit;
}

const TEMPERATURE_STEP: Record<string, number> = { degC: 1, K: 1, degF: 5 / 9, degR: 5 / 9 };

/** A temperature in K; a step (a difference) read in its own unit, so `5 degC` is 5 K, not 278.15 K. */
function temperature(x: unknown, what: string, difference = false): number {
  if (!isUnit(x) || toQuantity(x)!.unit !== "K") throw new Error(`${what} is a temperature with its unit (-40 degC, 358.15 K), got ${formatValue(x)}`);
  const own = x.units.length === 1 ? x.units[0].unit.name : "";
  return difference && own in TEMPERATURE_STEP ? x.toNumber(own) * TEMPERATURE_STEP[own] : toQuantity(x)!.si;
}

const name = (x: unknown, what: string) => {
  if (typeof x !== "string" || !x.trim()) throw new Error(`${what} is a name in quotes, such as "V1" or "out"`);
  return x.trim();
};

function perDecade(n: unknown, call: string): number {
  if (typeof n !== "number" || !Number.isInteger(n) || n < 1) throw new Error(`${call}: points per decade is a whole number`);
  return n;
}

export function builtins(given: SimHooks): Map<string, unknown> {
  const fns = new Map<string, unknown>();
  // An analysis that ended with sweep(…) carries it to the simulator side.
  const sweeping: { spec: SweepSpec | null } = { spec: null };
  const hooks: SimHooks = {
    ...given,
    simulate: (a) => given.simulate(sweeping.spec ? { ...a, sweep: { name: sweeping.spec.name, values: sweeping.spec.values, labels: sweeping.spec.labels } } : a),
  };
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
  const run = (a: Analysis) => {
    const { result, index } = hooks.simulate(a);
    return new SimHandle(a, result, index);
  };
  fns.set("dc", (source: unknown, from: unknown, to: unknown, step: unknown) => {
    const src = name(source, "dc(source, from, to, step): the source");
    if (src.toLowerCase() === "temp")
      return run({ kind: "dc", source: "temp", from: temperature(from, "dc() from"), to: temperature(to, "dc() to"), step: temperature(step, "dc() step", true) });
    const unit = /^i/i.test(src) ? "A" : "V";
    return run({ kind: "dc", source: src, from: inUnit(from, unit, "dc() from"), to: inUnit(to, unit, "dc() to"), step: inUnit(step, unit, "dc() step") });
  });
  fns.set("noise", (node: unknown, source: unknown, f1: unknown, f2: unknown, n: unknown) =>
    run({
      kind: "noise", node: name(node, "noise(node, source, f1, f2, per_decade): the node"), source: name(source, "noise(): the source"),
      f1: inUnit(f1, "Hz", "noise() f1"), f2: inUnit(f2, "Hz", "noise() f2"), perDecade: perDecade(n, "noise(node, source, f1, f2, per_decade)"),
    }),
  );
  fns.set("tf", (node: unknown, source: unknown) => run({ kind: "tf", node: name(node, "tf(node, source): the node"), source: name(source, "tf(node, source): the source") }));
  fns.set("op", () => {
    const a: Analysis = { kind: "op" };
    const { result, index } = hooks.simulate(a);
    return new SimHandle(a, result, index);
  });
  for (const [name, spec] of Object.entries(MEASURES)) {
    fns.set(name, (res: unknown, ...given: unknown[]) => {
      const names = [...(spec.node === false ? [] : ["node"]), ...spec.args.map(([a]) => a)];
      const call = `${name}(res${names.map((a) => `, ${a}`).join("")})`;
      if (!(res instanceof SimHandle)) throw new Error(`${call}: the first argument must be a simulation result`);
      if (!spec.analyses.includes(res.analysis.kind))
        throw new Error(`${call} needs a ${spec.analyses.map((a) => `${a}()`).join(" or ")} result, got ${res.analysis.kind}()`);
      const node = spec.node === false ? "" : given.shift();
      if (typeof node !== "string") throw new Error(`${call}: the node is a string such as "out"`);
      if (name === "f3db") return f3dbOf(hooks, res, node, given);
      const optional = spec.defaults?.length ?? 0;
      if (given.length > spec.args.length || given.length < spec.args.length - optional)
        throw new Error(`${call} takes ${optional ? `${names.length + 1 - optional} to ` : ""}${names.length + 1} arguments`);
      const ctx: Context = { analysis: res.analysis, node };
      const args = spec.args.map(([a, unit], k) =>
        k < given.length ? inUnit(given[k], unitIn(unit, ctx), `${name}() ${a}`) : spec.defaults![k - (spec.args.length - optional)],
      );
      const value = measured(hooks, name, res.result, node, args);
      if (Array.isArray(value)) {
        if (spec.args[0]?.[0] === "from") hooks.window(res.index, { node, from: args[0] as number, to: args[1] as number, measure: name });
        return familyValue(value, unitIn(spec.unit, ctx), res.result as Family);
      }
      if (spec.args[0]?.[0] === "from") hooks.window(res.index, { node, from: args[0], to: args[1], measure: name, value });
      if (name === "gain_db" || name === "phase") hooks.mark(res.index, { node, x: args[0], label: name === "gain_db" ? "gain" : "phase", value });
      if (spec.mark && Number.isFinite(value)) hooks.mark(res.index, { node, x: value, label: spec.mark });
      const unit = unitIn(spec.unit, ctx);
      return unit ? (math.unit(value, unit) as Unit) : value;
    });
  }
  addSweeps(fns, hooks, sweeping);
  return fns;
}

/**
 * `sweep(name, values)` and the analyses that end with it: the analysis runs as written with the
 * sweep attached, and the simulator side expands it into one run per value.
 */
function addSweeps(fns: Map<string, unknown>, hooks: SimHooks, sweeping: { spec: SweepSpec | null }) {
  fns.set("sweep", (name: unknown, values: unknown) => makeSweep(name, values, hooks.units ?? new Map()));
  for (const name of SWEPT_ANALYSES) {
    const run = fns.get(name) as ((...args: unknown[]) => unknown) | undefined;
    if (!run) continue;
    fns.set(name, (...args: unknown[]) => {
      const last = args[args.length - 1];
      if (!(last instanceof SweepSpec)) return run(...args);
      sweeping.spec = last;
      try {
        return run(...args.slice(0, -1));
      } finally {
        sweeping.spec = null;
      }
    });
  }
}
