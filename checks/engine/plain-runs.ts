import type { MathNode } from "mathjs";
import type { Corner } from "../corners";
import type { Statement } from "../script/analyze";
import type { CheckOutcome, ScriptRun } from "../script/evaluate";
import { paramDeps } from "./script-facts";

/** What a tolerance point needs of a plain run: its checks' outcomes and the reported quantities' SI values. */
export type PlainPoint = { checks: CheckOutcome[]; values: Record<string, number> };

// mathjs functions whose value is not fixed by their arguments.
const RANDOM = new Set(["random", "randomInt", "pickRandom"]);

/**
 * Whether each statement's value is fixed by the parameters paramDeps says it reads: no random
 * numbers, no assignment inside an expression or into an element (`a[2] = R1`, which paramDeps does
 * not follow), and no function that reads a name a later line assigns (it would see that line's value).
 */
export function readsAreKnown(statements: Statement[]): boolean {
  const assignedFrom = (i: number) => new Set(statements.slice(i).flatMap((s) => (s.name ? [s.name] : [])));
  return statements.every((st, i) => {
    if (st.kind === "expr" && st.node.type === "AssignmentNode") return false;
    if (st.kind === "function" && [...st.deps].some((d) => assignedFrom(i).has(d))) return false;
    let known = true;
    const node = st.node as unknown as { value?: MathNode; expr?: MathNode };
    const inner = st.kind === "assign" ? node.value! : st.kind === "function" ? node.expr! : st.node;
    inner.traverse((n) => {
      if (n.type === "AssignmentNode" || n.type === "FunctionAssignmentNode") known = false;
      if (n.type === "FunctionNode" && RANDOM.has((n as unknown as { fn: { name?: string } }).fn.name ?? "")) known = false;
    });
    return known;
  });
}

/**
 * The plain (unsimulated) script at many tolerance points. A check or a quantity reads only some
 * parameters, directly or through earlier lines, and points that agree on those give it the same
 * outcome. So the script runs only at a point where some check or quantity meets values it has not
 * met before; the rest is filled in from those runs. Ten toleranced parameters whose checks read
 * four each cost tens of runs instead of 1024, with the same outcomes at every corner. A script
 * whose reads are not known for certain (readsAreKnown) runs at every point.
 */
export function plainRunner(
  statements: Statement[],
  params: string[],
  quantities: string[],
  run: (c: Corner) => ScriptRun,
  valueOf: (run: ScriptRun, name: string) => number,
): (c: Corner) => PlainPoint {
  const full = (c: Corner): PlainPoint => {
    const r = run(c);
    return { checks: r.checks, values: Object.fromEntries(quantities.map((name) => [name, valueOf(r, name)])) };
  };
  if (!readsAreKnown(statements)) return full;
  const deps = paramDeps(statements, params);
  const sorted = (s: Set<string> | undefined) => [...(s ?? [])].sort();
  const checkReads = statements.filter((st) => st.kind === "check").map((st) => sorted(deps.get(st)));
  // A quantity is what its last assignment made it.
  const last = new Map(statements.filter((st) => st.kind === "assign").map((st) => [st.name!, st]));
  const quantityReads = quantities.map((name) => sorted(deps.get(last.get(name)!)));
  const checkSeen = checkReads.map(() => new Map<string, CheckOutcome>());
  const valueSeen = quantities.map(() => new Map<string, number>());
  const keyOf = (reads: string[], c: Corner) => reads.map((p) => c.values[p]).join(",");
  return (c) => {
    const checkKeys = checkReads.map((reads) => keyOf(reads, c));
    const valueKeys = quantityReads.map((reads) => keyOf(reads, c));
    const known = checkKeys.every((k, j) => checkSeen[j].has(k)) && valueKeys.every((k, j) => valueSeen[j].has(k));
    if (known)
      return {
        checks: checkKeys.map((k, j) => checkSeen[j].get(k)!),
        values: Object.fromEntries(quantities.map((name, j) => [name, valueSeen[j].get(valueKeys[j])!])),
      };
    const point = full(c);
    point.checks.forEach((outcome, j) => checkSeen[j].set(checkKeys[j], outcome));
    quantities.forEach((name, j) => valueSeen[j].set(valueKeys[j], point.values[name]));
    return point;
  };
}
