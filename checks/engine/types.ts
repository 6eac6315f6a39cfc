import type { BlockError } from "../block/types";

/** How a check or quantity was evaluated over the tolerances (DESIGN.md "Check scripts"). */
export type Method = "nominal" | "corners" | "worst-case" | "montecarlo";

export type CheckReport = {
  label: string;
  status: "pass" | "fail" | "error" | "skipped";
  detail: string;
  line?: number;
  simulated: boolean;
  over: Method;
  /** Simulations this check's verdict rests on (simulated checks only). */
  simulations?: number;
  /** The worst point: a corner (or Monte Carlo sample) naming only the parameters the check depends on. */
  worst?: { corner: Record<string, string>; detail: string; sample?: number };
  /** `labels[k]` names the parameter ends of corner k (`{ R: "+1%", C: "-5%" }`), in the order of `values`. */
  corners?: { quantity: string; unit: string; values: number[]; nominal: number; limits: number[]; labels?: Record<string, string>[] };
  /** What the check compared, in SI numbers, so a plot can draw it: the value, its limits (with `relations`), a near()'s target. */
  compared?: { quantity: string; unit: string; value: number; limits: number[]; relations: string[]; target?: number };
  /** After montecarlo(N): the passing fraction and its 95 % interval. */
  yield?: { value: number; lo: number; hi: number; samples: number; interval: string; target?: number };
};

export type Quantity = {
  value: number;
  unit: string;
  text: string;
  simulated?: true;
  /** Range over the tolerance points (and samples) this quantity was evaluated at. */
  spread?: { min: number; max: number; over: Method };
  /** Monte Carlo: the quantity at every sample, in sample order (NaN where it could not be evaluated). */
  samples?: number[];
};

export type Report = {
  slug: string;
  status: "verified" | "failing" | "error" | "unchecked";
  quantities: Record<string, Quantity>;
  checks: CheckReport[];
  simulations: { analysis: string; card?: string; points: number; ms: number; cached?: boolean; corner?: Record<string, string> | null; sample?: number }[];
  errors: BlockError[];
  /** Tolerance parameters and how simulated checks visited them; Monte Carlo settings when asked for. */
  tolerance?: { parameters: number; simulated: Method; plain: Method; montecarlo?: { samples: number; target?: number; interval: string } };
};

/**
 * Plot data. Waveforms with the same `group` belong on one plot: the nominal trace, the worst
 * corner's trace (`variant: "worst"`, `corner`), or a sweep's members (`variant: "member"`, `sweep`).
 */
export type Waveform = {
  analysis: "tran" | "ac" | "dc" | "noise";
  x: number[];
  /** dc and noise plots: the x and y units ("degC" for a temperature sweep, "V/Hz^0.5" for noise). */
  xUnit?: string;
  yUnit?: string;
  series: { node: string; values: number[]; phase?: number[] }[];
  windows: { node: string; from: number; to: number; measure: string; value?: number }[];
  marks: { node: string; x: number; label: string; value?: number }[];
  group?: number;
  variant?: "nominal" | "worst" | "member";
  corner?: Record<string, string>;
  sweep?: { name: string; value: number; text: string };
};
