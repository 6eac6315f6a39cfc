import type { Analysis } from "../spice/types";

// What each measure reads after (res, node) and the unit of its result (DESIGN.md "Check
// scripts"). Units that depend on the simulation are worked out from `Context`.
export type Context = { analysis: Analysis; node: string };

type UnitOf = string | ((c: Context) => string);
export type MeasureSpec = {
  analyses: Analysis["kind"][];
  /** false: the measure reads the whole result (tf), not a node. */
  node?: false;
  args: [name: string, unit: UnitOf][];
  /** Trailing arguments that may be left out, with their defaults. */
  defaults?: number[];
  unit: UnitOf;
  /** Draw the result on the plot with this label (an x value: time, frequency or swept value). */
  mark?: string;
};

/** The unit of a node's values: a current for "i(V1)", else a voltage. */
export const nodeUnit = ({ node }: Context) => (/^i\(/i.test(node.trim()) ? "A" : "V");
/** The unit of the swept value of a dc() result. */
export const sweepUnit = ({ analysis }: Context) =>
  analysis.kind !== "dc" ? "s" : analysis.source.toLowerCase() === "temp" ? "K" : /^i/i.test(analysis.source) ? "A" : "V";
const inputUnit = ({ analysis }: Context) => ("source" in analysis && /^i/i.test(analysis.source) ? "A" : "V");
const per = (a: UnitOf, b: UnitOf) => (c: Context) => {
  const [x, y] = [typeof a === "string" ? a : a(c), typeof b === "string" ? b : b(c)];
  return x === y ? "" : `${x}/${y}`;
};
const noiseUnit = (rms: boolean) => (c: Context) => {
  const u = c.node === "in" ? inputUnit(c) : "V";
  return rms ? u : `${u}/Hz^0.5`;
};
const atUnit = (c: Context) => (c.analysis.kind === "dc" ? sweepUnit(c) : "s");

const WINDOW: [string, string][] = [["from", "s"], ["to", "s"]];
const tran = (unit: UnitOf, args: [string, UnitOf][] = WINDOW): MeasureSpec => ({ analyses: ["tran"], args, unit });

export const MEASURES: Record<string, MeasureSpec> = {
  peak: tran(nodeUnit),
  trough: tran(nodeUnit),
  pp: tran(nodeUnit),
  rms: tran(nodeUnit),
  avg: tran(nodeUnit),
  freq: tran("Hz"),
  thd: tran(""),
  at: { analyses: ["tran", "dc"], args: [["x", atUnit]], unit: nodeUnit },
  startup: { analyses: ["tran"], args: [["level", nodeUnit]], unit: "s", mark: "start-up" },
  gain_db: { analyses: ["ac"], args: [["f", "Hz"]], unit: "dB" },
  phase: { analyses: ["ac"], args: [["f", "Hz"]], unit: "deg" },
  f3db: { analyses: ["ac"], args: [], unit: "Hz" },
  v: { analyses: ["op"], args: [], unit: "V" },
  i: { analyses: ["op"], args: [], unit: "A" },
  slope: { analyses: ["dc"], args: [["x", sweepUnit]], unit: per(nodeUnit, sweepUnit) },
  crossing: { analyses: ["dc"], args: [["level", nodeUnit]], unit: sweepUnit, mark: "crossing" },
  noise_density: { analyses: ["noise"], args: [["f", "Hz"]], unit: noiseUnit(false) },
  noise_rms: { analyses: ["noise"], args: [], unit: noiseUnit(true) },
  tf_gain: { analyses: ["tf"], node: false, args: [], unit: per("V", inputUnit) },
  tf_rin: { analyses: ["tf"], node: false, args: [], unit: "ohm" },
  tf_rout: { analyses: ["tf"], node: false, args: [], unit: "ohm" },
  peak_freq: { analyses: ["ac"], args: [], unit: "Hz", mark: "peak" },
  peak_gain_db: { analyses: ["ac"], args: [], unit: "dB" },
  max_gain_db: { analyses: ["ac"], args: [["f1", "Hz"], ["f2", "Hz"]], unit: "dB" },
  min_gain_db: { analyses: ["ac"], args: [["f1", "Hz"], ["f2", "Hz"]], unit: "dB" },
  cross_freq: { analyses: ["ac"], args: [["level", "dB"]], unit: "Hz", mark: "crossing" },
  phase_margin: { analyses: ["ac"], args: [], unit: "deg" },
  rise_time: { analyses: ["tran"], args: [["lo", ""], ["hi", ""]], defaults: [0.1, 0.9], unit: "s" },
  overshoot: { analyses: ["tran"], args: [], unit: "" },
  settling_time: { analyses: ["tran"], args: [["band", ""]], unit: "s" },
  slew_rate: { analyses: ["tran"], args: [], unit: per(nodeUnit, "s") },
};

export const unitIn = (u: UnitOf, c: Context) => (typeof u === "string" ? u : u(c));
