import type { MathNode } from "mathjs";
import type { BlockError } from "../block/types";
import type { Statement } from "./analyze";
import { ConditionJudge, type Judged } from "./condition";
import { takeReasons } from "./builtins";
import { isComplexValue, math } from "./math";
import { plainTypeMessage } from "./unit-rules";

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
  const m = plainTypeMessage((e instanceof Error ? e.message : String(e)).replace(/^Error: /, ""));
  // mathjs's own words when a complex value meets a function or comparison made for reals.
  if (!/became complex/.test(m) && /complex/i.test(m)) return `the value became complex (${m})`;
  return m;
}

/**
 * Run the statements in order. With simulate=false, statements that need a simulation
 * are left out and their checks reported as skipped; nothing else can depend on them.
 */
export function runScript(statements: Statement[], scope: Map<string, unknown>, simulate: boolean, text = true): ScriptRun {
  const run: ScriptRun = { scope, checks: [], errors: [], assigned: [] };
  // Names whose statement failed: where, and why (a corner run keeps no error list of its own).
  const failed = new Map<string, { line: number; why: string }>();
  // Names holding NaN from a measure with nothing to measure, and why.
  const empty = new Map<string, string[]>();
  takeReasons();
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
        run.checks.push({ ...base, status: "error", detail: `${broken} (line ${failed.get(broken)!.line}) could not be evaluated: ${failed.get(broken)!.why}`, margin: -Infinity });
        continue;
      }
      try {
        const j = new ConditionJudge(scope, text).judge(condition);
        const why = [...[...st.deps].flatMap((d) => empty.get(d) ?? []), ...takeReasons()];
        const detail = why.length && text ? `${j.text} (${[...new Set(why)].join("; ")})` : j.text;
        const ok = j.ok && why.length === 0; // a check never passes on a measure that had nothing to measure
        run.checks.push({ ...base, status: ok ? "pass" : "fail", detail, margin: why.length || Number.isNaN(j.margin) ? -Infinity : j.margin, primary: j.primary });
      } catch (e) {
        takeReasons();
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
      const value = st.evaluate(scope);
      // A complex value the guarded functions let through. Complex on purpose (the script builds
      // one with complex(), or from a complex variable) is left alone.
      if (st.kind !== "function" && isComplexValue(value) && !/\bcomplex\s*\(/.test(st.source) && ![...st.deps].some((d) => isComplexValue(scope.get(d))))
        throw new Error(`the value became complex: ${st.name ? `${st.name} = ` : ""}${math.format(value as never, { precision: 4 })}, where a real number or quantity was expected`);
      if (st.kind === "assign" && st.name) {
        run.assigned.push({ name: st.name, simulated: st.simulated });
        const why = [...[...st.deps].flatMap((d) => empty.get(d) ?? []), ...takeReasons()];
        if (why.length) empty.set(st.name, why);
        else empty.delete(st.name);
      }
    } catch (e) {
      takeReasons();
      // A refused netlist points at its own line in the block file rather than the script's.
      const at = (e as { blockLine?: number }).blockLine;
      run.errors.push({ message: message(e), line: at ?? st.line });
      if (st.name) failed.set(st.name, { line: st.line, why: message(e) });
    }
  }
  return run;
}
