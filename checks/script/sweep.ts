import type { Unit } from "mathjs";
import { formatNumber, formatQuantity, toQuantity } from "../units";
import { isUnit, math } from "./math";

/** The analyses that take `sweep(name, values)` as their last argument (DESIGN.md "Check scripts"). */
export const SWEPT_ANALYSES = ["tran", "ac", "op", "dc", "noise", "tf"];
const ZERO_C = 273.15;

/** A sweep as a script value: what to vary and its values (SI; temperatures in kelvin), with labels. */
export class SweepSpec {
  constructor(readonly name: string, readonly values: number[], readonly labels: string[]) {}
  toString() {
    return `sweep(${this.name}, [${this.labels.join(", ")}])`;
  }
}

/** The sweep a request carries: `temp` goes to the deck's .temp line in °C, a parameter to its .param line. */
export type Sweep = { name: string; values: number[]; labels: string[] };

/** A swept analysis's result: one simulation result per value, in order. */
export class Family {
  constructor(readonly sweep: Sweep, readonly members: unknown[]) {}
}

/** A measure over a family: one value per member, as a mathjs vector that remembers its members' labels. */
export function familyValue(values: number[], unit: string, family: Family): unknown {
  const m = math.matrix(values.map((v) => (unit ? (math.unit(v, unit) as Unit) : v)));
  Object.defineProperty(m, "members", { value: family.sweep.labels.map((l) => `${family.sweep.name} ${l}`), enumerable: false });
  return m;
}

export const membersOf = (x: unknown): string[] | undefined => (x as { members?: string[] } | null)?.members;

/**
 * `sweep(name, values)`: `name` is a parameter (values in its unit) or "temp" (values in degC, K
 * or degF); the analysis it ends runs once per value. Parameters in `units` give each one's unit.
 */
export function makeSweep(name: unknown, values: unknown, units: Map<string, string>): SweepSpec {
  if (typeof name !== "string") throw new Error('sweep(name, values): the name is a string, a parameter or "temp"');
  const list = math.isMatrix(values) ? (values.toArray() as unknown[]).flat() : Array.isArray(values) ? values.flat() : [values];
  if (list.length < 1 || list.length > 50) throw new Error("sweep(name, values): between 1 and 50 values, e.g. [-40 degC, 25 degC, 85 degC]");
  if (name === "temp") {
    const si = list.map((v) => {
      const q = isUnit(v) ? toQuantity(v) : null;
      if (!q || q.unit !== "K") throw new Error(`sweep("temp", …): ${String(v)} needs a temperature unit (degC, K, degF)`);
      return q.si;
    });
    return new SweepSpec("temp", si, si.map((k) => `${formatNumber(k - ZERO_C, 4)} °C`));
  }
  const unit = units.get(name);
  if (unit === undefined) throw new Error(`sweep("${name}", …): no parameter named ${name}; sweep a parameter or "temp"`);
  const si = list.map((v) => {
    const q = toQuantity(v);
    if (!q || (q.unit !== unit && !(typeof v === "number" && unit === ""))) throw new Error(`sweep("${name}", …): ${String(v)} is not in ${unit || "plain numbers"}, the parameter's unit`);
    return q.si;
  });
  return new SweepSpec(name, si, si.map((x) => formatQuantity(x, unit, 4)));
}

/** The sweep's values as the deck holds them: .temp in °C. */
export const deckTemp = (kelvin: number) => Number((kelvin - ZERO_C).toPrecision(12));
