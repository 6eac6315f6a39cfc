import type { ParsedBlock } from "../block/types";
import { EXHAUSTIVE_LIMIT, allCorners, cornerAt, monteCarloSamples, toleranceCorners, toleranced, worstSigns, type Corner, type Toleranced } from "../corners";
import type { MathNode } from "mathjs";
import { SIM_CALLS, type Statement } from "../script/analyze";
import type { CheckOutcome } from "../script/evaluate";
import { toQuantity } from "../units";
import type { SimOutcome, SimRequest } from "./executor";
import { paramDeps } from "./script-facts";
import { analysisLine } from "../spice/deck";
import { runVariant, type Known, type SimSide, type SimUse, type VariantRun } from "./variant";

/** Simulated checks visit all 2^k corners when that costs at most the sensitivity pass twice over (k ≤ 3). */
export const SIM_EXHAUSTIVE_LIMIT = 3;
/** Monte Carlo samples waiting for simulations at one time: bounds the results held in memory. */
const SAMPLE_CHUNK = 64;

export type MonteCarlo = { n: number; target?: number };
export type PointKind = "corner" | "sensitivity" | "worst" | "sample";

/** One evaluated variant, kept small: what the report needs, not the simulation results. */
export type Done = {
  id: string;
  kind: PointKind | "nominal";
  corner: Corner;
  sample?: number;
  checks: CheckOutcome[];
  values: Record<string, number>;
  simKeys: string[];
  /** Kept for nominal and corner variants only: their waveforms can be drawn. */
  full?: VariantRun;
};

/**
 * The simulated part of a verification as a state machine: `step()` runs every variant it can
 * with the results known so far and returns the simulations still missing; `absorb()` takes
 * their outcomes; repeat until a step returns nothing. Steps = depth of sequential simulations.
 */
export class Verification {
  readonly tol: Toleranced[];
  readonly known = new Map<string, Known>();
  readonly done = new Map<string, Done>();
  /** What each simulation run was, for the report's list (results themselves are dropped when done with). */
  readonly meta = new Map<string, { analysis: string; card: string; points: number; ms: number; cached?: boolean; error?: string }>();
  private samples: Corner[] = [];
  private names: string[] = [];
  /** Simulation requests of the nominal variant's first pass: the per-variant cost for the plan. */
  firstRequests: SimRequest[] = [];

  constructor(
    readonly block: ParsedBlock,
    readonly statements: Statement[],
    readonly side: SimSide | null,
    readonly mc: MonteCarlo | null,
    private parse: (o: SimOutcome & { ok: true }, req: SimRequest) => Known,
  ) {
    this.tol = simulationTolerances(block, statements);
    // The same seeded samples as the plain checks, with what the circuit cannot see held at
    // nominal (as at the corners), so a simulated check compares the circuit with itself.
    if (mc && side) {
      const seen = new Set(this.tol.map((t) => t.p.name));
      this.samples = monteCarloSamples(block.params, toleranced(block.params), mc.n).map((c) => ({
        label: Object.fromEntries(Object.entries(c.label).filter(([k]) => seen.has(k))),
        values: Object.fromEntries(Object.entries(c.values).map(([k, x]) => [k, seen.has(k) ? x : block.params.find((p) => p.name === k)!.si])),
      }));
    }
  }

  get simulates() {
    return this.side !== null && this.statements.some((s) => s.simulated);
  }

  get exhaustive() {
    return this.tol.length <= SIM_EXHAUSTIVE_LIMIT;
  }

  /** Variants a complete run evaluates (nominal, corners or sensitivity + worst, samples). */
  plannedVariants(simulatedChecks: number): number {
    if (!this.simulates) return 0;
    const k = this.tol.length;
    const corners = k === 0 ? 0 : this.exhaustive ? 2 ** k : k + simulatedChecks;
    return 1 + corners + this.samples.length;
  }

  step(): SimRequest[] {
    const pending = new Map<string, SimRequest>();
    const inUse = new Set<string>();
    const need = (id: string, kind: Done["kind"], corner: Corner, sample?: number): Done | null => {
      const had = this.done.get(id);
      if (had) return had;
      const v = runVariant(this.block, this.statements, corner.values, this.known, this.side, true);
      if (id === "nominal" && this.firstRequests.length === 0) this.firstRequests = v.pending;
      if (v.pending.length) {
        for (const r of v.pending) pending.set(r.key, r);
        for (const s of v.sims) for (const k of s.keys) inUse.add(k);
        return null;
      }
      const d: Done = { id, kind, corner, checks: v.run.checks, values: this.valuesOf(v), simKeys: v.sims.flatMap((s) => s.keys), ...(sample !== undefined ? { sample } : {}) };
      if (kind !== "sample" && kind !== "sensitivity") d.full = v;
      this.done.set(id, d);
      return d;
    };
    const nominal = need("nominal", "nominal", { label: {}, values: cornerAt(this.block.params, this.tol, this.tol.map(() => 0)).values });
    if (this.simulates && this.tol.length > 0) {
      if (this.exhaustive) allCorners(this.block.params, this.tol).forEach((c, i) => need(`c${i}`, "corner", c));
      else {
        const sens = this.tol.map((_, i) => need(`s${i}`, "sensitivity", cornerAt(this.block.params, this.tol, this.tol.map((_, j) => (i === j ? 1 : 0)))));
        if (nominal && sens.every(Boolean))
          nominal.checks.forEach((c, j) => {
            if (!c.simulated || c.status === "error" || c.status === "skipped") return;
            const signs = worstSigns(sens.map((s) => s!.checks[j].margin - c.margin), c.margin);
            if (signs.some((s) => s !== 0)) need(`w${signs.join(",")}`, "worst", cornerAt(this.block.params, this.tol, signs));
          });
      }
    }
    let waiting = 0;
    for (let i = 0; i < this.samples.length && waiting < SAMPLE_CHUNK; i++) if (!need(`m${i}`, "sample", this.samples[i], i)) waiting++;
    // Results only the finished sample and sensitivity variants read are not needed again.
    const keep = new Set(inUse);
    for (const d of this.done.values()) if (d.full) for (const k of d.simKeys) keep.add(k);
    for (const k of this.known.keys()) if (!keep.has(k)) this.known.delete(k);
    return [...pending.values()];
  }

  absorb(reqs: SimRequest[], outcomes: SimOutcome[]) {
    outcomes.forEach((o, i) => {
      let k: Known;
      try {
        k = o.ok ? this.parse(o, reqs[i]) : { ok: false, error: o.error, ...(o.line !== undefined ? { line: o.line } : {}) };
      } catch (e) {
        k = { ok: false, error: (e as Error).message };
      }
      this.known.set(o.key, k);
      // The card lets a deck for other tools run the same analyses (`?format=spice`).
      this.meta.set(o.key, { analysis: reqs[i].analysis.kind, card: analysisLine(reqs[i].analysis), points: k.ok ? k.result.points : 0, ms: o.ms, ...(o.ok ? { cached: o.cached } : { error: o.error }) });
    });
  }

  /** SI values of the nominal run's reported quantities in this variant. */
  private valuesOf(v: VariantRun): Record<string, number> {
    if (this.names.length === 0 && v.run.assigned.length) this.names = v.run.assigned.map((a) => a.name);
    const out: Record<string, number> = {};
    for (const a of v.run.assigned) {
      const q = toQuantity(v.run.scope.get(a.name));
      if (q && Number.isFinite(q.si)) out[a.name] = q.si;
    }
    return out;
  }

  nominal(): Done | undefined {
    return this.done.get("nominal");
  }

  points(): Done[] {
    return [...this.done.values()].filter((d) => d.kind !== "nominal" && d.kind !== "sample");
  }

  sampleRuns(): Done[] {
    return [...this.done.values()].filter((d) => d.kind === "sample").sort((a, b) => a.sample! - b.sample!);
  }
}

/**
 * Tolerance points for checks that need no simulation (cheap: no simulator): all 2^k corners
 * for k ≤ 10; above that each check's predicted worst corner from one +tol run per parameter,
 * besides a seeded sample of 500, so no worst case is left to chance.
 */
export function plainPoints(block: ParsedBlock, run: (c: Corner) => CheckOutcome[], nominal: CheckOutcome[]): { method: "none" | "corners" | "worst-case"; points: { corner: Corner; checks: CheckOutcome[] }[] } {
  const tol = toleranced(block.params);
  const base = toleranceCorners(block.params);
  const points = base.corners.map((corner) => ({ corner, checks: run(corner) }));
  if (tol.length > EXHAUSTIVE_LIMIT) {
    const sens = tol.map((_, i) => run(cornerAt(block.params, tol, tol.map((_, j) => (i === j ? 1 : 0)))));
    const seen = new Set<string>();
    nominal.forEach((c, j) => {
      const signs = worstSigns(sens.map((s) => s[j].margin - c.margin), c.margin);
      const id = signs.join(",");
      if (seen.has(id) || signs.every((s) => s === 0)) return;
      seen.add(id);
      const corner = cornerAt(block.params, tol, signs);
      points.push({ corner, checks: run(corner) });
    });
  }
  return { method: base.method, points };
}

export type { SimUse };

/**
 * The toleranced parameters a simulation can see: named in the circuit (comments aside) or read
 * by a statement that starts one (a tran() stop time from a formula). A parameter only the hand
 * side of a check reads (a zener voltage the diode model fixes) stays nominal in simulated
 * checks' corners: moving it there would compare the circuit with a different circuit.
 */
export function simulationTolerances(block: ParsedBlock, statements: Statement[]): Toleranced[] {
  const circuit = block.netlist
    .split("\n")
    .filter((l) => !/^\s*\*/.test(l))
    .map((l) => l.replace(/[;$].*$/, ""))
    .join("\n");
  const deps = paramDeps(statements, block.params.map((p) => p.name));
  const read = new Set(statements.filter(startsSimulation).flatMap((s) => [...deps.get(s)!]));
  // A parameter a sweep sets takes the sweep's values in every member: its tolerance is moot there.
  const swept = new Set(statements.flatMap(sweptNames));
  const escape = (n: string) => n.replace(/[^A-Za-z0-9_]/g, "");
  return toleranced(block.params).filter(({ p }) => !swept.has(p.name)).filter(({ p }) => read.has(p.name) || new RegExp(`(^|[^A-Za-z0-9_])${escape(p.name)}($|[^A-Za-z0-9_])`, "i").test(circuit));
}

function sweptNames(s: Statement): string[] {
  const out: string[] = [];
  s.node.traverse((n) => {
    if (n.type !== "FunctionNode" || (n as unknown as { fn: { name?: string } }).fn.name !== "sweep") return;
    const first = (n as unknown as { args: MathNode[] }).args[0] as MathNode & { value?: unknown };
    if (first?.type === "ConstantNode" && typeof first.value === "string") out.push(first.value);
  });
  return out;
}

function startsSimulation(s: Statement): boolean {
  let found = false;
  s.node.traverse((n) => {
    if (n.type === "FunctionNode" && SIM_CALLS.has((n as unknown as { fn: { name?: string } }).fn.name ?? "")) found = true;
  });
  return found;
}
