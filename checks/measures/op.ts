import { MeasureError, expectAnalysis, vectorOf } from "./signal";
import type { SimResult } from "../spice/types";

/** Operating-point voltage of a node, in volts. */
export function v(res: SimResult, node: string): number {
  expectAnalysis(res, "op", "v");
  return vectorOf(res, node)[0];
}

/** Operating-point current through a voltage source (SPICE sign: into its + terminal), in amperes. */
export function i(res: SimResult, source: string): number {
  expectAnalysis(res, "op", "i");
  const name = `i(${String(source).trim().toLowerCase()})`;
  const x = res.vectors[name];
  if (!x) {
    const known = Object.keys(res.vectors).filter((n) => n.startsWith("i(")).map((n) => n.slice(2, -1));
    throw new MeasureError(`i(): no current for "${source}" (ngspice writes currents of: ${known.join(", ") || "none"})`);
  }
  return x[0];
}
