import type { MathNode } from "mathjs";
import type { BlockError } from "../block/types";
import type { Statement } from "./analyze";
import { ConditionJudge, type Judged } from "./condition";

export type CheckOutcome = {
  label: string;
  line: number;
  simulated: boolean;
  status: "pass" | "fail" | "error" | "skipped";
  detail: string;
  margin: number;
  primary?: Judged["primary"];
};

export type ScriptRun = {
  scope: Map<string, unknown>;
  checks: CheckOutcome[];
  errors: BlockError[];
  /** Top-level assignments that were evaluated, in order, with whether they need a simulation. */
  assigned: { name: string; simulated: boolean }[];
};

function message(e: unknown): string {
  if (e instanceof RangeError && /call stack/i.test(e.message)) return `the script recursed too deep (${e.message})`;
  const m = e instanceof Error ? e.message : String(e);
  return m.replace(/^Error: /, "");
}

/**
 * Run the statements in order. With simulate=false, statements that need a simulation
 * are left out and their checks reported as skipped; nothing else can depend on them.
 */
export function runScript(statements: Statement[], scope: Map<string, unknown>, simulate: boolean, text = true): ScriptRun {
  const run: ScriptRun = { scope, checks: [], errors: [], assigned: [] };
  const failed = new Map<string, number>();
  for (const st of statements) {
    const broken = [...st.deps].find((d) => failed.has(d));
    if (st.kind === "check") {
      const [labelNode, condition] = (st.node as unknown as { args: MathNode[] }).args;
      let label = labelNode.toString();
      try {
        const l = labelNode.compile().evaluate(scope);
        if (typeof l === "string") label = l;
        else throw new Error("the label must be a string in quotes");
      } catch (e) {
        run.checks.push({ label, line: st.line, simulated: st.simulated, status: "error", detail: message(e), margin: -Infinity });
        continue;
      }
      const base = { label, line: st.line, simulated: st.simulated };
      if (st.simulated && !simulate) {
        run.checks.push({ ...base, status: "skipped", detail: "needs a simulation", margin: 0 });
        continue;
      }
      if (broken) {
        run.checks.push({ ...base, status: "error", detail: `${broken} (line ${failed.get(broken)}) could not be evaluated`, margin: -Infinity });
        continue;
      }
      try {
        const j = new ConditionJudge(scope, text).judge(condition);
        run.checks.push({ ...base, status: j.ok ? "pass" : "fail", detail: j.text, margin: j.margin, primary: j.primary });
      } catch (e) {
        run.checks.push({ ...base, status: "error", detail: message(e), margin: -Infinity });
      }
      continue;
    }
    if (st.simulated && !simulate) continue;
    if (broken) {
      if (st.name) failed.set(st.name, failed.get(broken)!);
      continue;
    }
    try {
      st.evaluate(scope);
      if (st.kind === "assign" && st.name) run.assigned.push({ name: st.name, simulated: st.simulated });
    } catch (e) {
      // A refused netlist points at its own line in the block file rather than the script's.
      const at = (e as { blockLine?: number }).blockLine;
      run.errors.push({ message: message(e), line: at ?? st.line });
      if (st.name) failed.set(st.name, st.line);
    }
  }
  return run;
}
