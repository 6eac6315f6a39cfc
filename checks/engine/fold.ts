import type { Corner } from "../corners";
import type { CheckOutcome } from "../script/evaluate";
import { formatNumber, toQuantity } from "../units";
import { comparedOf } from "./report";
import { wilson, YIELD_INTERVAL } from "./stats";
import type { CheckReport, Method } from "./types";

export type Point = { corner: Corner; outcome: CheckOutcome; sample?: number };

const siOf = (x: unknown) => toQuantity(x)?.si ?? NaN;
const pct = (x: number) => `${formatNumber(100 * x, 3)} %`;
const describe = (label: Record<string, string>) => Object.entries(label).map(([k, v]) => `${k} ${v}`).join(", ");

/** A corner's label cut to the parameters the check depends on. */
function only(label: Record<string, string>, depends: Set<string>): Record<string, string> {
  const out: Record<string, string> = {};
  for (const k in label) if (depends.has(k)) out[k] = label[k];
  return out;
}

// For a simulated check, a measure with nothing to measure at a corner (a dead oscillator) is the
// circuit failing there; only a simulator failure makes the check an error.
const broken = (c: CheckOutcome) => c.status === "error" && (!c.simulated || /simulation: /.test(c.detail));

/**
 * Fold a check's outcomes at its tolerance points (corners, predicted worst corners, samples)
 * into its nominal result: it passes only where it passes everywhere, except that with a
 * Monte Carlo target the verdict is whether the yield's lower bound reaches the target.
 */
export function foldCheck(
  nominal: CheckOutcome,
  o: { method: Method; points: Point[]; samples: Point[]; target?: number; depends: Set<string>; detailAt: (k: number) => string; simulations: number },
): CheckReport {
  const out: CheckReport = { label: nominal.label, status: nominal.status, detail: nominal.detail, line: nominal.line, simulated: nominal.simulated, over: "nominal" };
  const compared = comparedOf(nominal.primary);
  if (compared) out.compared = compared;
  if (nominal.simulated) out.simulations = o.simulations;
  if (nominal.status === "skipped") return out;
  const { points, samples } = o;
  out.over = samples.length ? "montecarlo" : points.length ? o.method : "nominal";
  if (points.length === 0 && samples.length === 0) return out;

  const all: Point[] = [...points, ...samples];
  let worst = -1;
  // A NaN margin (a measure with nothing to measure) is as bad as it gets.
  const m = (p: Point) => (Number.isNaN(p.outcome.margin) ? -Infinity : p.outcome.margin);
  all.forEach((p, k) => {
    if (worst < 0 || m(p) < m(all[worst])) worst = k;
  });
  const failing = points.filter((p) => p.outcome.status !== "pass").length;
  const brokenAt = points.findIndex((p) => broken(p.outcome));
  const notes: string[] = [];
  if (nominal.status !== "error" && brokenAt >= 0) {
    out.status = "error";
    notes.push(`at corner ${describe(points[brokenAt].corner.label)}: ${points[brokenAt].outcome.detail}`);
  } else if (failing > 0) {
    if (nominal.status === "pass") out.status = "fail";
    const first = points.find((p) => p.outcome.status !== "pass")!;
    const why = first.outcome.status === "error" ? ` (${describe(only(first.corner.label, o.depends))}: ${first.outcome.detail})` : "";
    notes.push(`${nominal.status === "fail" ? "fails at nominal and at" : "fails at"} ${failing} of ${points.length} ${o.method === "worst-case" ? "evaluated corners" : "tolerance corners"}${why}`);
  }
  if (samples.length) {
    const passed = samples.filter((c) => c.outcome.status === "pass").length;
    const { lo, hi } = wilson(passed, samples.length);
    out.yield = { value: passed / samples.length, lo, hi, samples: samples.length, interval: YIELD_INTERVAL, ...(o.target !== undefined ? { target: o.target } : {}) };
    notes.push(`yield ${pct(passed / samples.length)} (${pct(lo)}–${pct(hi)}, ${YIELD_INTERVAL}) over ${samples.length} samples${o.target !== undefined ? `, target ${pct(o.target)}` : ""}`);
    if (nominal.status !== "error" && out.status !== "error") {
      if (o.target !== undefined) out.status = lo >= o.target ? "pass" : "fail";
      else if (passed < samples.length) out.status = "fail";
    }
  }
  if (notes.length) out.detail = `${nominal.detail}; ${notes.join("; ")}`;
  if (worst >= 0) {
    const w = all[worst];
    const detail = w.outcome.detail || (w.sample === undefined ? o.detailAt(worst) : "");
    out.worst = { corner: only(w.corner.label, o.depends), detail, ...(w.sample !== undefined ? { sample: w.sample } : {}) };
  }
  const p = nominal.primary;
  const read = new Map<unknown, number>();
  const siOnce = (x: unknown) => read.get(x) ?? read.set(x, siOf(x)).get(x)!;
  if (p && points.length && points.every((c) => c.outcome.primary?.label === p.label)) {
    out.corners = {
      quantity: p.label,
      unit: toQuantity(p.value)?.unit ?? "",
      // Corners that share an outcome (engine/plain-runs.ts) share its value: each is read once.
      values: points.map((c) => siOnce(c.outcome.primary!.value)),
      nominal: siOf(p.value),
      limits: p.limits.map(siOf),
      labels: points.map((c) => only(c.corner.label, o.depends)),
    };
  }
  return out;
}
