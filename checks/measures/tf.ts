import { MeasureError, expectAnalysis } from "./signal";
import type { SimResult } from "../spice/types";

// ngspice's .tf writes three values: the small-signal DC gain from the source to the output,
// the input resistance seen by the source and the output resistance at the output node.
function value(res: SimResult, match: (name: string) => boolean, what: string, measure: string): number {
  expectAnalysis(res, "tf", measure);
  const name = Object.keys(res.vectors).find(match);
  if (!name) throw new MeasureError(`${measure}(): ngspice wrote no ${what} (it wrote ${Object.keys(res.vectors).join(", ")})`);
  return res.vectors[name][0];
}

export const tf_gain = (res: SimResult) => value(res, (n) => n === "transfer_function", "transfer function", "tf_gain");
export const tf_rin = (res: SimResult) => value(res, (n) => n.endsWith("#input_impedance"), "input resistance", "tf_rin");
export const tf_rout = (res: SimResult) => value(res, (n) => n.startsWith("output_impedance_at_"), "output resistance", "tf_rout");
