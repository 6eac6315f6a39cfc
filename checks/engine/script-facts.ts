import type { MathNode } from "mathjs";
import type { ParsedBlock } from "../block/types";
import type { Statement } from "../script/analyze";
import { noSimulation, scopeFor } from "./prepare";
import type { MonteCarlo } from "./verification";

export const MAX_SAMPLES = 10_000;

const callName = (n: MathNode) => (n.type === "FunctionNode" ? (n as unknown as { fn: { name?: string } }).fn.name : undefined);

/** The script's montecarlo(N) or montecarlo(N, target) statement, read once before any variant runs. */
export function monteCarloOf(block: ParsedBlock, statements: Statement[]): MonteCarlo | null {
  const found = statements.filter((s) => callName(s.node) === "montecarlo");
  if (found.length === 0) return null;
  const fail = (message: string, line: number) => Object.assign(new Error(message), { line });
  if (found.length > 1) throw fail("montecarlo() may appear once in a script", found[1].line);
  const st = found[0];
  const args = (st.node as unknown as { args: MathNode[] }).args;
  const scope = scopeFor(block, Object.fromEntries(block.params.map((p) => [p.name, p.si])), noSimulation);
  const [n, target] = args.map((a) => a.compile().evaluate(scope));
  if (args.length < 1 || args.length > 2) throw fail("montecarlo(N) or montecarlo(N, target)", st.line);
  if (typeof n !== "number" || !Number.isInteger(n) || n < 1 || n > MAX_SAMPLES)
    throw fail(`montecarlo(N): N is a whole number of samples from 1 to ${MAX_SAMPLES}`, st.line);
  if (target !== undefined && (typeof target !== "number" || !(target > 0 && target < 1)))
    throw fail("montecarlo(N, target): the target is a yield between 0 and 1, e.g. 99%", st.line);
  return { n, ...(target !== undefined ? { target } : {}) };
}

/** For each statement, the parameters it reads directly or through earlier assignments. */
export function paramDeps(statements: Statement[], params: string[]): Map<Statement, Set<string>> {
  const through = new Map<string, Set<string>>();
  const out = new Map<Statement, Set<string>>();
  for (const st of statements) {
    const set = new Set<string>();
    for (const d of st.deps) {
      if (params.includes(d)) set.add(d);
      else for (const p of through.get(d) ?? []) set.add(p);
    }
    if (st.name) through.set(st.name, set);
    out.set(st, set);
  }
  return out;
}
