import type { BlockError } from "../block/types";
import { toleranceCorners } from "../corners";
import { defaultModelsDir } from "../spice/paths";
import { sanitizeNetlist } from "../spice/sanitize";
import type { Analysis, SimHooks } from "../script/builtins";
import { runScript, type CheckOutcome } from "../script/evaluate";
import { deckValues, nominalValues, noSimulation, prepare, scopeFor } from "./prepare";
import { quantitiesOf, reportStatus, withCorners } from "./report";
import type { Report, SimBackend, Waveform } from "./types";

export type EvaluateOptions = { simulate?: boolean; params?: Record<string, string>; backend?: SimBackend };

/**
 * The whole check run for one block file: the script at nominal (with simulations when
 * asked and a backend is given), then every non-simulated check at each tolerance corner.
 */
export function evaluateBlock(text: string, opts: EvaluateOptions = {}): { report: Report; waveforms: Waveform[] } {
  const { block, statements, errors, slug } = prepare(text, opts.params);
  const report: Report = { slug, status: "error", quantities: {}, checks: [], simulations: [], errors };
  // Frontmatter errors stop here; script syntax errors do not, so the other lines still evaluate.
  if (!block) {
    report.status = reportStatus(report);
    return { report, waveforms: [] };
  }
  // A refused netlist is reported at once, in previews too, on its line in the block file.
  const refused = netlistRefusal(block.netlist, block.netlistLine);
  if (refused) report.errors.push(refused);
  const simulate = Boolean(opts.simulate && opts.backend && !refused);
  const sims: { analysis: Analysis; result: unknown; windows: Waveform["windows"]; marks: Waveform["marks"]; nodes: Set<string> }[] = [];
  const hooks: SimHooks = simulate
    ? {
        simulate: (analysis) => {
          if (!block.netlist.trim()) throw new Error("the block has no ```spice fence to simulate");
          const values = deckValues(block, nominalValues(block));
          try {
            const r = opts.backend!.simulate({ title: block.title, circuit: block.netlist, params: values, analysis });
            report.simulations.push({ analysis: analysis.kind, points: r.points, ms: r.ms, ...(r.cached !== undefined ? { cached: r.cached } : {}) });
            sims.push({ analysis, result: r.result, windows: [], marks: [], nodes: new Set() });
            return { result: r.result, index: sims.length - 1 };
          } catch (e) {
            const line = opts.backend!.errorLine(e, block.netlistLine);
            throw Object.assign(new Error(`simulation: ${(e as Error).message}`), { blockLine: line });
          }
        },
        measure: (name, result, node, args) => {
          const sim = sims.find((s) => s.result === result);
          sim?.nodes.add(node);
          return opts.backend!.measure(name, result, node, args);
        },
        window: (i, w) => pushOnce(sims[i].windows, w),
        mark: (i, m) => pushOnce(sims[i].marks, m),
      }
    : noSimulation;

  const nominal = runScript(statements, scopeFor(block, nominalValues(block), hooks), simulate);
  report.errors.push(...nominal.errors);
  report.quantities = quantitiesOf(nominal.scope, nominal.assigned);

  // Corners run without detail text; the worst corner of each check is rerun with it.
  const { corners } = toleranceCorners(block.params);
  const cornerStatements = statements.filter((s) => !s.simulated);
  const cornerRun = (k: number, text: boolean) => runScript(cornerStatements, scopeFor(block, corners[k].values, noSimulation), false, text).checks;
  const perCorner = corners.map((_, k) => cornerRun(k, false));
  const withText = new Map<number, CheckOutcome[]>();
  const detailAt = (corner: number, check: number) => {
    if (!withText.has(corner)) withText.set(corner, cornerRun(corner, true));
    return withText.get(corner)![check].detail;
  };
  const plain = nominal.checks.filter((c) => !c.simulated);
  report.checks = nominal.checks.map((c) => {
    const k = plain.indexOf(c);
    if (k < 0) return withCorners(c, [], [], () => "");
    return withCorners(c, perCorner.map((checks) => checks[k]), corners, (corner) => detailAt(corner, k));
  });
  report.status = reportStatus(report);

  const waveforms: Waveform[] = [];
  for (const s of sims) {
    if (s.analysis.kind === "op") continue;
    const w = opts.backend!.waveform(s.result, s.analysis, [...s.nodes]);
    if (w) waveforms.push({ ...w, windows: union(w.windows, s.windows), marks: union(w.marks, s.marks) });
  }
  return { report, waveforms };
}

// The plot's own marks (its -3 dB point) and the script's measured ones, each drawn once.
function union<T>(a: T[], b: T[]): T[] {
  const out = [...a];
  for (const x of b) pushOnce(out, x);
  return out;
}

// The same window measured twice (peak for two checks) is drawn once.
function pushOnce<T>(list: T[], item: T) {
  const key = JSON.stringify(item);
  if (!list.some((x) => JSON.stringify(x) === key)) list.push(item);
}

function netlistRefusal(netlist: string, firstLine: number): BlockError | null {
  if (!netlist.trim()) return null;
  try {
    sanitizeNetlist(netlist, defaultModelsDir());
    return null;
  } catch (e) {
    const line = (e as { line?: number }).line;
    return { message: `netlist: ${(e as Error).message}`, ...(line !== undefined ? { line: firstLine + line - 1 } : {}) };
  }
}
