import * as measures from "../measures";
import type { SimSide } from "../engine/variant";
import { resultFromRaw, type SimResult } from "../spice";
import { simRequest } from "../spice/request";
import type { ModelTexts } from "../spice/sanitize";

type Measure = (res: SimResult, node: string, ...args: (number | string)[]) => number;

/**
 * ngspice decks and the waveform measures, as the engine's simulator side (loaded in the sandbox child only).
 * `models`: the team's resolved model files, carried in every deck so any worker can run it.
 */
export function simSide(models?: ModelTexts): SimSide {
  return {
    request: (input) => simRequest({ ...input, models }),
    parse: (req, raw) => resultFromRaw(req.analysis, raw, 0, false),
    measure: (name, result, node, args) => {
      const fn = (measures as unknown as Record<string, Measure>)[name];
      if (typeof fn !== "function") throw new Error(`no measure named ${name}`);
      return fn(result, node, ...args);
    },
    waveform: (res, nodes) => {
      if (res.analysis === "op" || res.analysis === "tf") return null;
      const names = nodes.length ? nodes : ["out"].filter((n) => n in res.vectors || res.analysis === "noise");
      return names.length ? measures.waveformFor(res, names) : null;
    },
  };
}
