export type Analysis = (
  | { kind: "tran"; stop: number; step: number; uic?: boolean }
  | { kind: "ac"; f1: number; f2: number; perDecade: number }
  | { kind: "op" }
  /** `source` is an independent source's name or "temp"; temperatures are in K here, °C in the deck. */
  | { kind: "dc"; source: string; from: number; to: number; step: number }
  | { kind: "noise"; node: string; source: string; f1: number; f2: number; perDecade: number }
  | { kind: "tf"; node: string; source: string }
) & {
  /** Run once per value of a parameter or "temp" (the engine expands it; never in a deck). */
  sweep?: { name: string; values: number[]; labels: string[] };
  /** Circuit temperature in °C for this run, written as a .temp line. */
  temp?: number;
};

export type SimRequest = {
  title: string;
  circuit: string;                 // the block's ```spice fence, lines counted from 1
  params: Record<string, number>;  // SI numbers, written as .param lines
  analysis: Analysis;
  models?: Record<string, string>; // model files the caller resolved (team first), by include name; before the shared folder
};

export type SimOptions = {
  cacheDir?: string;      // default ASSAY_SIM_CACHE or var/sim-cache under the repo root
  noCache?: boolean;
  modelsDir?: string;     // default ASSAY_MODELS_DIR or content/models under the repo root
  timeoutMs?: number;     // wall clock for one ngspice run, default 20 s
  engineVersion?: string; // folded into the cache key (default ENGINE_VERSION) so an engine bump reruns simulations
};

export type ComplexVector = { re: Float64Array; im: Float64Array };

export type SimResult = {
  analysis: Analysis["kind"];
  scale: Float64Array;                     // time (tran), frequency (ac, noise), the swept value (dc; K for temp); empty for op and tf
  // Lowercase names: "v(out)", "i(v1)" and the plain node name "out". For ac these hold magnitudes.
  vectors: Record<string, Float64Array>;
  complex?: Record<string, ComplexVector>; // ac only, same names as vectors
  totals?: Record<string, number>;
  sweep?: string;                          // dc only: the swept source's name, or "temp"         // noise only: "onoise_total", "inoise_total" (rms over the band)
  points: number;
  ms: number;
  cached: boolean;
};

/** A refusal or failure of the netlist or of ngspice; `line` counts from 1 in the circuit text. */
export class SpiceError extends Error {
  line?: number;
  constructor(message: string, line?: number) {
    super(message);
    this.name = "SpiceError";
    if (line !== undefined) this.line = line;
  }
}
