import type { MathNode } from "mathjs";
import type { BlockError } from "../block/types";
import { math, parseExpression } from "./math";
import { MEASURES } from "./measure-specs";

export const SIM_CALLS = new Set(["tran", "ac", "op", "dc", "noise", "tf"]);
export const MEASURE_CALLS = new Set(Object.keys(MEASURES));

const OTHER_CALLS = new Set(["check", "near", "eseries"]);

export type Statement = {
  line: number;
  source: string;
  node: MathNode;
  kind: "check" | "assign" | "function" | "expr";
  /** The name an assignment or function definition binds. */
  name?: string;
  /** Variables this statement reads. */
  deps: Set<string>;
  /** Needs a simulation result, directly or through a variable that does. */
  simulated: boolean;
  evaluate: (scope: Map<string, unknown>) => unknown;
};

/** Names read by a node, leaving out the parameters of function definitions inside it. */
function reads(node: MathNode, calls: Set<string>): Set<string> {
  const out = new Set<string>();
  const walk = (n: MathNode, bound: Set<string>) => {
    if (n.type === "FunctionAssignmentNode") {
      const f = n as unknown as { params: string[]; expr: MathNode };
      walk(f.expr, new Set([...bound, ...f.params]));
      return;
    }
    if (n.type === "FunctionNode") {
      const fn = (n as unknown as { fn: MathNode }).fn;
      if (fn.type === "SymbolNode") calls.add((fn as unknown as { name: string }).name);
    }
    if (n.type === "SymbolNode") {
      const name = (n as unknown as { name: string }).name;
      if (!bound.has(name)) out.add(name);
    }
    n.forEach((child) => walk(child, bound));
  };
  walk(node, new Set());
  return out;
}

function nestedCheck(node: MathNode): boolean {
  let found = false;
  node.forEach((c) =>
    c.traverse((n) => {
      if (n.type === "FunctionNode" && (n as unknown as { fn: { name?: string } }).fn.name === "check") found = true;
    }),
  );
  return found;
}

/** A unit name (`K`, `kohm`) that is not also a function the script can call. */
function unitNotFunction(name: string, functions: Set<string>): boolean {
  if (functions.has(name) || SIM_CALLS.has(name) || MEASURE_CALLS.has(name) || OTHER_CALLS.has(name)) return false;
  if (typeof (math as unknown as Record<string, unknown>)[name] === "function") return false;
  return math.Unit.isValuelessUnit(name);
}

/**
 * mathjs reads `C2 (R1 + R2)` and `300 K (Rs + Rp)` as calls of C2 and K. When the name holds
 * a value (a parameter or an earlier assignment) or is a unit, and not a function, the engineer
 * meant a product: rewrite it so.
 */
function productsForValueCalls(node: MathNode, values: Set<string>, functions: Set<string> = new Set()): MathNode {
  return node.transform((n) => {
    // `a (b)^2` is a times b squared: the power binds to the parenthesis, not to the product.
    if (n.type === "OperatorNode" && (n as unknown as { fn: string }).fn === "pow") {
      const [base, exponent] = (n as unknown as { args: MathNode[] }).args;
      const call = base as unknown as { type: string; fn: MathNode & { name?: string }; args: MathNode[] };
      if (call.type === "FunctionNode" && call.fn.type === "SymbolNode" && call.args.length === 1 && (values.has(call.fn.name!) || unitNotFunction(call.fn.name!, functions))) {
        const [factor, power] = [productsForValueCalls(call.args[0], values, functions), productsForValueCalls(exponent, values, functions)];
        const names: Record<string, MathNode> = { a: call.fn, b: factor, c: power };
        return parseExpression("a * (b) ^ (c)").transform((m) => (m.type === "SymbolNode" ? names[(m as unknown as { name: string }).name] : m));
      }
    }
    if (n.type !== "FunctionNode") return n;
    const { fn, args } = n as unknown as { fn: MathNode & { name?: string }; args: MathNode[] };
    if (fn.type !== "SymbolNode" || args.length !== 1) return n;
    if (!values.has(fn.name!) && !unitNotFunction(fn.name!, functions)) return n;
    const factor = productsForValueCalls(args[0], values, functions);
    return parseExpression("a * (b)").transform((m) =>
      m.type === "SymbolNode" ? ((m as unknown as { name: string }).name === "a" ? fn : factor) : m,
    );
  });
}

/** Parse a check script line by line (one statement a line, `#` comments), marking what needs a simulation. */
export function analyzeScript(script: string, firstLine: number, errors: BlockError[], params: string[] = []): Statement[] {
  const out: Statement[] = [];
  const simVars = new Set<string>();
  const values = new Set(params);
  const functions = new Set<string>();
  script.split("\n").forEach((raw, i) => {
    const line = firstLine + i;
    const source = raw.replace(/\r$/, "");
    if (!source.trim() || source.trim().startsWith("#")) return;
    let root: MathNode;
    try {
      root = parseExpression(source);
    } catch (e) {
      errors.push({ message: `script: ${(e as Error).message}`, line });
      return;
    }
    const parts = root.type === "BlockNode" ? (root as unknown as { blocks: { node: MathNode }[] }).blocks.map((b) => b.node) : [root];
    for (const part of parts) {
      const node = productsForValueCalls(part, values, functions);
      const calls = new Set<string>();
      const deps = reads(node, calls);
      let kind: Statement["kind"] = "expr";
      let name: string | undefined;
      if (node.type === "FunctionNode" && (node as unknown as { fn: { name?: string } }).fn.name === "check") kind = "check";
      else if (node.type === "AssignmentNode") {
        const object = (node as unknown as { object: MathNode }).object;
        if (object.type === "SymbolNode") [kind, name] = ["assign", (object as unknown as { name: string }).name];
      } else if (node.type === "FunctionAssignmentNode") [kind, name] = ["function", (node as unknown as { name: string }).name];
      if (name && params.includes(name)) {
        // Tolerance corners vary the parameters; a script that overwrote one would hide that.
        errors.push({ message: `${name} is a parameter: change its value in the frontmatter, not in the script`, line });
        continue;
      }
      if (nestedCheck(node)) {
        errors.push({ message: "check() must stand on a line of its own", line });
        continue;
      }
      if (kind === "check" && (node as unknown as { args: MathNode[] }).args.length !== 2) {
        errors.push({ message: 'check() takes a label and a condition: check("label", x > 1 V)', line });
        continue;
      }
      const simulated = [...calls].some((c) => SIM_CALLS.has(c) || MEASURE_CALLS.has(c)) || [...deps].some((d) => simVars.has(d));
      if (kind === "assign" && name) {
        values.add(name);
        functions.delete(name);
      }
      if (kind === "function" && name) {
        values.delete(name);
        functions.add(name);
      }
      if (simulated && name) simVars.add(name);
      else if (name) simVars.delete(name);
      const compiled = node.compile();
      out.push({ line, source, node, kind, name, deps, simulated, evaluate: (scope) => compiled.evaluate(scope) });
    }
  });
  return out;
}
