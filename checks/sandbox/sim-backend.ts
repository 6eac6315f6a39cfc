import * as measures from "../measures";
import { simulate, SpiceError, type SimResult } from "../spice";
import type { SimBackend } from "../engine/types";
import { ENGINE_VERSION } from "../version";

type Measure = (res: SimResult, node: string, ...args: (number | string)[]) => number;

/** ngspice and the waveform measures, as the engine's simulator side (loaded in the sandbox child only). */
export function simBackend(opts: { cacheDir?: string } = {}): SimBackend {
  return {
    simulate: (req) => {
      const r = simulate(req, { cacheDir: opts.cacheDir, engineVersion: ENGINE_VERSION });
      return { result: r, points: r.points, ms: r.ms, cached: r.cached };
    },
    measure: (name, result, node, args) => {
      const fn = (measures as unknown as Record<string, Measure>)[name];
      if (typeof fn !== "function") throw new Error(`no measure named ${name}`);
      return fn(result as SimResult, node, ...args);
    },
    waveform: (result, _analysis, nodes) => {
      const res = result as SimResult;
      if (res.analysis === "op") return null;
      const names = nodes.length ? nodes : ["out"].filter((n) => n in res.vectors);
      return names.length ? measures.waveformFor(res, names) : null;
    },
    errorLine: (error, netlistLine) =>
      error instanceof SpiceError && error.line !== undefined && netlistLine > 0 ? netlistLine + error.line - 1 : undefined,
  };
}
