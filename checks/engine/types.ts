import type { BlockError } from "../block/types";
import type { Analysis } from "../script/builtins";

export type CheckReport = {
  label: string;
  status: "pass" | "fail" | "error" | "skipped";
  detail: string;
  line?: number;
  simulated: boolean;
  worst?: { corner: Record<string, string>; detail: string };
  corners?: { quantity: string; unit: string; values: number[]; nominal: number; limits: number[] };
  /** What the check compared, in SI numbers, so a plot can draw it: the value, its limits (with `relations`), a near()'s target. */
  compared?: { quantity: string; unit: string; value: number; limits: number[]; relations: string[]; target?: number };
};

export type Report = {
  slug: string;
  status: "verified" | "failing" | "error" | "unchecked";
  quantities: Record<string, { value: number; unit: string; text: string; simulated?: true }>;
  checks: CheckReport[];
  simulations: { analysis: "tran" | "ac" | "op"; points: number; ms: number; cached?: boolean }[];
  errors: BlockError[];
};

export type Waveform = {
  analysis: "tran" | "ac";
  x: number[];
  series: { node: string; values: number[]; phase?: number[] }[];
  windows: { node: string; from: number; to: number; measure: string; value?: number }[];
  marks: { node: string; x: number; label: string; value?: number }[];
};

/** What the engine needs from the simulator side; the sandbox child wires in ngspice. */
export type SimBackend = {
  simulate: (req: { title: string; circuit: string; params: Record<string, number>; analysis: Analysis }) => {
    result: unknown;
    points: number;
    ms: number;
    cached?: boolean;
  };
  measure: (name: string, result: unknown, node: string, args: (number | string)[]) => number;
  waveform: (result: unknown, analysis: Analysis, nodes: string[]) => Waveform | null;
  /** Block-file line for an error the simulator raised, given where the netlist starts. */
  errorLine: (error: unknown, netlistLine: number) => number | undefined;
};
