import type { ParsedBlock } from "../block/types";
import type { Statement } from "../script/analyze";
import type { Analysis, SimHooks } from "../script/builtins";
import { runScript, type ScriptRun } from "../script/evaluate";
import { deckTemp, Family } from "../script/sweep";
import type { SimResult } from "../spice/types";
import type { SimRequest } from "./executor";
import { deckValues, scopeFor } from "./prepare";
import type { Waveform } from "./types";

/** What the engine knows of one simulation: its parsed result, or why it failed. */
export type Known = { ok: true; result: SimResult; ms: number; cached: boolean } | { ok: false; error: string; line?: number };

/** The simulator-facing side a variant needs: requests from inputs, measures and plots of results. */
export type SimSide = {
  /** The deck for one simulation; the side carries the model files the block's includes resolve to. */
  request: (input: { title: string; circuit: string; params: Record<string, number>; analysis: Analysis }) => SimRequest;
  measure: (name: string, result: SimResult, node: string, args: (number | string)[]) => number;
  waveform: (result: SimResult, nodes: string[]) => Waveform | null;
  /** The raw file an executor returned, read for this request's analysis. */
  parse: (req: SimRequest, raw: Uint8Array) => SimResult;
};

export type SimUse = { analysis: Analysis; key: string; keys: string[]; result: SimResult | Family; windows: Waveform["windows"]; marks: Waveform["marks"]; nodes: Set<string> };

export type VariantRun = {
  run: ScriptRun;
  /** Simulations the script asked for that are not known yet: the run is incomplete. */
  pending: SimRequest[];
  sims: SimUse[];
};

/** One member of a sweep: the analysis at a temperature, or the values with one parameter set. */
function memberOf(analysis: Analysis, name: string, x: number, values: Record<string, number>): { analysis: Analysis; values: Record<string, number> } {
  if (name === "temp") return { analysis: { ...analysis, temp: deckTemp(x) }, values };
  return { analysis, values: { ...values, [name]: x } };
}

/** Thrown into the script when a simulation's result is not known yet; the variant reruns later. */
class Pending extends Error {}

/**
 * Run the script once at these parameter values, answering simulations from `known`. A miss
 * records the request and stops that statement (and what depends on it); the rest runs on,
 * so every independent simulation of the variant is requested in the same pass.
 */
export function runVariant(
  block: ParsedBlock,
  statements: Statement[],
  values: Record<string, number>,
  known: Map<string, Known>,
  side: SimSide | null,
  text: boolean,
): VariantRun {
  const pending: SimRequest[] = [];
  const sims: SimUse[] = [];
  const hooks: SimHooks = {
    simulate: (analysis) => {
      if (!side) throw new Error("simulations run only in a full verification");
      if (!block.netlist.trim()) throw new Error("the block has no ```spice fence to simulate");
      const { sweep, ...single } = analysis;
      const members = sweep ? sweep.values.map((x) => memberOf(single, sweep.name, x, values)) : [{ analysis: single, values }];
      const reqs = members.map((m) => {
        try {
          return side.request({ title: block.title, circuit: block.netlist, params: deckValues(block, m.values), analysis: m.analysis });
        } catch (e) {
          throw located(e, (e as { line?: number }).line, block.netlistLine);
        }
      });
      const missing = reqs.filter((r) => !known.has(r.key));
      if (missing.length) {
        pending.push(...missing);
        throw new Pending("waiting for a simulation");
      }
      const results = reqs.map((r) => {
        const k = known.get(r.key)!;
        if (!k.ok) throw located(new Error(k.error), k.line, block.netlistLine);
        return k.result;
      });
      const result = sweep ? new Family(sweep, results) : results[0];
      sims.push({ analysis, key: reqs.map((r) => r.key).join("+"), keys: reqs.map((r) => r.key), result, windows: [], marks: [], nodes: new Set() });
      return { result, index: sims.length - 1 };
    },
    measure: (name, result, node, args) => {
      sims.find((s) => s.result === result)?.nodes.add(node);
      if (!(result instanceof Family)) return side!.measure(name, result as SimResult, node, args);
      // One value per member; a member with nothing to measure gives NaN (the check then fails there).
      return result.members.map((m) => {
        try {
          return side!.measure(name, m as SimResult, node, args);
        } catch (e) {
          if ((e as Error).name === "NothingToMeasure") return NaN;
          throw e;
        }
      });
    },
    units: new Map(block.params.map((p) => [p.name, p.unit])),
    window: (i, w) => pushOnce(sims[i].windows, w),
    mark: (i, m) => pushOnce(sims[i].marks, m),
  };
  const run = runScript(statements, scopeFor(block, values, hooks), side !== null, text);
  return { run, pending, sims };
}

function located(e: unknown, line: number | undefined, netlistLine: number): Error {
  const blockLine = line !== undefined && netlistLine > 0 ? netlistLine + line - 1 : undefined;
  const message = (e as Error).message.replace(/^simulation: /, "");
  return Object.assign(new Error(`simulation: ${message}`), blockLine !== undefined ? { blockLine } : {});
}

// The same window measured twice (peak for two checks) is drawn once.
export function pushOnce<T>(list: T[], item: T) {
  const key = JSON.stringify(item);
  if (!list.some((x) => JSON.stringify(x) === key)) list.push(item);
}
