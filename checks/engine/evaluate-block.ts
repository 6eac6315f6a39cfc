import type { BlockError, ParsedBlock } from "../block/types";
import { cornerAt, monteCarloSamples, toleranced, type Corner } from "../corners";
import { defaultModelsDir } from "../spice/paths";
import { sanitizeNetlist, type ModelTexts } from "../spice/sanitize";
import type { Statement } from "../script/analyze";
import { runScript, type CheckOutcome } from "../script/evaluate";
import { toQuantity } from "../units";
import type { RunProgress, SimExecutor } from "./executor";
import { foldCheck, type Point } from "./fold";
import { planFor, type RunCap } from "./plan";
import { plainRunner, type PlainPoint } from "./plain-runs";
import { monteCarloOf, paramDeps } from "./script-facts";
import { noSimulation, prepare, scopeFor } from "./prepare";
import { quantitiesOf, reportStatus } from "./report";
import { YIELD_INTERVAL } from "./stats";
import type { Method, Report, Waveform } from "./types";
import { runVariant, type SimSide } from "./variant";
import { plainPoints, Verification, type MonteCarlo } from "./verification";
import { waveformsOf } from "./waveforms";

export type EvaluateOptions = {
  simulate?: boolean;
  params?: Record<string, string>;
  /** Runs the simulations (default: none, so simulated checks are skipped). */
  executor?: SimExecutor;
  /** The simulator-facing side: requests, measures, plots (the sandbox child wires in ngspice). */
  side?: SimSide;
  progress?: RunProgress;
  cap?: RunCap;
  /** The model files `.include` may name, as the caller resolved them for the block's team (team first, then shared). */
  models?: ModelTexts;
};

type Started = { report: Report; block: ParsedBlock | null; statements: Statement[]; v: Verification | null; mc: MonteCarlo | null };

function start(text: string, opts: EvaluateOptions): Started {
  const { block, statements, errors, slug } = prepare(text, opts.params);
  const report: Report = { slug, status: "error", quantities: {}, checks: [], simulations: [], errors };
  // Frontmatter errors stop here; script syntax errors do not, so the other lines still evaluate.
  if (!block) return { report, block, statements, v: null, mc: null };
  // A refused netlist is reported at once, in previews too, on its line in the block file.
  const refused = netlistRefusal(block.netlist, block.netlistLine, opts.models);
  if (refused) report.errors.push(refused);
  let mc: MonteCarlo | null = null;
  try {
    mc = monteCarloOf(block, statements);
  } catch (e) {
    report.errors.push({ message: (e as Error).message, line: (e as { line?: number }).line });
  }
  const simulate = Boolean(opts.simulate && opts.side && opts.executor && !refused);
  const v = new Verification(block, statements, simulate ? opts.side! : null, mc, (o, req) => ({ ok: true, result: opts.side!.parse(req, o.raw), ms: o.ms, cached: o.cached }));
  return { report, block, statements, v, mc };
}

/** The checks that need no simulation, at nominal and their tolerance points; a preview's whole run. */
export function evaluateBlock(text: string, opts: { params?: Record<string, string>; models?: ModelTexts } = {}): { report: Report; waveforms: Waveform[] } {
  const s = start(text, { params: opts.params, models: opts.models });
  return finish(s);
}

/**
 * The whole check run for one block file: nominal, tolerance points and samples, every
 * simulation through the executor, step after step until no variant waits for one.
 */
export async function evaluateBlockAsync(text: string, opts: EvaluateOptions): Promise<{ report: Report; waveforms: Waveform[] }> {
  const s = start(text, opts);
  const v = s.v;
  if (!v || !v.simulates) return finish(s);
  const first = v.step();
  const simulatedChecks = s.statements.filter((st) => st.kind === "check" && st.simulated).length;
  const plan = planFor(v, first, simulatedChecks);
  const refusal = opts.cap && plan.exceeds(opts.cap);
  if (refusal) {
    s.report.errors.push({ message: refusal });
    return finish(s, true);
  }
  let done = 0;
  opts.progress?.(0, plan.total());
  for (let reqs = first; reqs.length; reqs = v.step()) {
    const base = done;
    const outcomes = await opts.executor!.runMany(reqs, (n) => opts.progress?.(base + n, Math.max(plan.total(), base + reqs.length)));
    done += reqs.length;
    v.absorb(reqs, outcomes);
    plan.saw(reqs.length);
  }
  opts.progress?.(done, done);
  return finish(s);
}

function finish(s: Started, refused = false): { report: Report; waveforms: Waveform[] } {
  const { report, block, statements, v, mc } = s;
  if (!block || !v) {
    report.status = reportStatus(report);
    return { report, waveforms: [] };
  }
  const full = v.simulates && !refused;
  const nominalDone = full ? v.nominal() : undefined;
  const nominal = nominalDone?.full?.run ?? runVariant(block, statements, cornerAt(block.params, v.tol, v.tol.map(() => 0)).values, new Map(), null, true).run;
  report.errors.push(...nominal.errors);
  report.quantities = quantitiesOf(nominal.scope, nominal.assigned);

  // Checks that need no simulation: every corner (or predicted worst corners), text only where shown.
  const plainStatements = statements.filter((st) => !st.simulated);
  const plainRun = (c: Corner, text = false) => runScript(plainStatements, scopeFor(block, c.values, noSimulation), false, text);
  const runner = plainRunner(plainStatements, block.params.map((p) => p.name), Object.keys(report.quantities), (c) => plainRun(c), siAt);
  const plainPointsRun = new Map<Corner, PlainPoint>();
  const plainAt = (c: Corner) => plainPointsRun.get(c) ?? plainPointsRun.set(c, runner(c)).get(c)!;
  const plainNominal = nominal.checks.filter((c) => !c.simulated);
  const plain = plainPoints(block, (c) => plainAt(c).checks, plainNominal);
  const plainSamples = mc ? monteCarloSamples(block.params, toleranced(block.params), mc.n) : [];
  const plainSampleRuns = plainSamples.map((c) => plainRun(c));
  const plainMethod: Method = plain.method === "none" ? "nominal" : plain.method;
  const simMethod: Method = v.tol.length === 0 ? "nominal" : v.exhaustive ? "corners" : "worst-case";
  const deps = paramDeps(statements, block.params.map((p) => p.name));
  const checkStatements = statements.filter((st) => st.kind === "check");
  const simPoints = full ? v.points() : [];
  const simSamples = full ? v.sampleRuns() : [];

  report.checks = nominal.checks.map((c, j) => {
    const depends = new Set(deps.get(checkStatements[j]) ?? []);
    if (!c.simulated) {
      const k = plainNominal.indexOf(c);
      const points: Point[] = plain.points.map((p) => ({ corner: p.corner, outcome: p.checks[k] }));
      const samples: Point[] = plainSampleRuns.map((r, i) => ({ corner: plainSamples[i], outcome: r.checks[k], sample: i }));
      return foldCheck(c, { method: plainMethod, points, samples, target: mc?.target, depends, detailAt: (i) => plainRun(plain.points[i].corner, true).checks[k].detail, simulations: 0 });
    }
    const points: Point[] = simPoints.map((d) => ({ corner: d.corner, outcome: d.checks[j] }));
    const samples: Point[] = simSamples.map((d) => ({ corner: d.corner, outcome: d.checks[j], sample: d.sample }));
    for (const name of sensitive(v.tol.map((t) => t.p.name), simPoints, j, c.margin)) depends.add(name);
    const simulations = [nominalDone, ...simPoints, ...simSamples].reduce((n, d) => n + (d?.simKeys.length ?? 0), 0);
    return foldCheck(c, { method: simMethod, points, samples, target: mc?.target, depends, detailAt: () => "", simulations });
  });

  // Spread of each quantity over the points it was evaluated at.
  for (const [name, q] of Object.entries(report.quantities)) {
    const sim = Boolean(q.simulated);
    const values = sim
      ? [...simPoints, ...simSamples].map((d) => d.values[name])
      : [...plain.points.map((p) => plainAt(p.corner).values[name]), ...plainSampleRuns.map((r) => siAt(r, name))];
    const finite = values.filter((x) => Number.isFinite(x));
    if (finite.length) {
      const over: Method = (sim ? simSamples.length : plainSampleRuns.length) ? "montecarlo" : sim ? simMethod : plainMethod;
      q.spread = { min: Math.min(q.value, ...finite), max: Math.max(q.value, ...finite), over };
    }
    if (mc) q.samples = sim ? simSamples.map((d) => d.values[name] ?? NaN) : plainSampleRuns.map((r) => siAt(r, name));
  }
  report.tolerance = {
    parameters: toleranced(block.params).length,
    simulated: simMethod,
    plain: plainMethod,
    ...(mc ? { montecarlo: { samples: mc.n, ...(mc.target !== undefined ? { target: mc.target } : {}), interval: YIELD_INTERVAL } } : {}),
  };
  const { simulations, waveforms } = full ? waveformsOf(v, report) : { simulations: [], waveforms: [] };
  report.simulations = simulations;
  report.status = reportStatus(report);
  return { report, waveforms };
}

const siAt = (run: { scope: Map<string, unknown> }, name: string) => toQuantity(run.scope.get(name))?.si ?? NaN;

/** Parameters whose move changed a simulated check's margin at some evaluated point. */
function sensitive(names: string[], points: { corner: Corner; checks: CheckOutcome[] }[], j: number, nominal: number): string[] {
  const out = new Set<string>();
  const tiny = 1e-9 * Math.max(1, Math.abs(nominal));
  for (const a of points)
    for (const b of [...points, null]) {
      const [la, lb] = [a.corner.label, b?.corner.label ?? {}];
      const moved = names.filter((n) => la[n] !== lb[n]);
      const mb = b ? b.checks[j].margin : nominal;
      if (moved.length === 1 && Math.abs(a.checks[j].margin - mb) > tiny) out.add(moved[0]);
    }
  return [...out];
}

function netlistRefusal(netlist: string, firstLine: number, models?: ModelTexts): BlockError | null {
  if (!netlist.trim()) return null;
  try {
    sanitizeNetlist(netlist, { modelsDir: defaultModelsDir(), models });
    return null;
  } catch (e) {
    const line = (e as { line?: number }).line;
    return { message: `netlist: ${(e as Error).message}`, ...(line !== undefined ? { line: firstLine + line - 1 } : {}) };
  }
}
