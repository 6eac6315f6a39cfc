import { all, create, type MathJsInstance, type MathNode, type Unit } from "mathjs";
import { unitRules } from "./unit-rules";

// One restricted mathjs instance for the whole engine, built once per process.
// Following the mathjs security notes: keep private references to parse/compile for
// the engine, then override the functions that let a script reach the parser, define
// units or rewrite the instance.
function build(): { math: MathJsInstance; parse: (expr: string) => MathNode } {
  const math = create(all, { number: "number", precision: 64 });
  // Decibels are a unit of their own so that `gain_db(...) > -3 dB` reads right; unitRules
  // lets a plain number beside dB (or deg) read as dB (or degrees).
  math.createUnit("dB");
  math.import(realDomainGuards(math), { override: true });
  math.import(unitRules(math), { override: true });
  const parse = math.parse.bind(math) as (expr: string) => MathNode;
  const refuse = (name: string) => () => {
    throw new Error(`${name}() is not available in check scripts`);
  };
  const disabled = [
    "import", "createUnit", "evaluate", "parse", "parser", "compile", "simplify",
    "simplifyConstant", "simplifyCore", "rationalize", "derivative", "resolve",
    "reviver", "replacer", "chain", "config",
  ];
  math.import(Object.fromEntries(disabled.map((n) => [n, refuse(n)])), { override: true });
  return { math, parse };
}

// mathjs answers sqrt(-1), asin(2), log(-1) and (-8)^(1/3) with a complex number. In a check
// script that is nearly always a design out of range (a fork that broke an assumption), and a
// complex value deep in a formula only surfaces lines later as a baffling type error. So these
// functions refuse to turn real arguments into a complex result, on the line that asked; they
// still compute with complex arguments, for a script that uses complex(0, 1) on purpose.
const REAL_DOMAIN = ["sqrt", "asin", "acos", "asec", "acsc", "acosh", "atanh", "acoth", "asech", "log", "log10", "log2", "log1p", "pow"];

export function isComplexValue(x: unknown): boolean {
  if (!x || typeof x !== "object") return false;
  const o = x as { isComplex?: boolean; type?: string; value?: unknown; isMatrix?: boolean; toArray?: () => unknown[] };
  if (o.isComplex) return true;
  if (o.type === "Unit") return isComplexValue(o.value);
  if (Array.isArray(x)) return x.some(isComplexValue);
  if (o.isMatrix && o.toArray) return o.toArray().some(isComplexValue);
  return false;
}

function realDomainGuards(math: MathJsInstance): Record<string, (...args: unknown[]) => unknown> {
  const show = (x: unknown) => math.format(x as never, { precision: 4 });
  return Object.fromEntries(
    REAL_DOMAIN.map((name) => {
      const fn = (math as unknown as Record<string, (...a: unknown[]) => unknown>)[name];
      const guarded = (...args: unknown[]) => {
        const r = fn(...args);
        if (isComplexValue(r) && !args.some(isComplexValue))
          throw new Error(`the value became complex: ${name}(${args.map(show).join(", ")}) = ${show(r)} has no real value`);
        return r;
      };
      return [name, guarded];
    }),
  );
}

const built = build();
export const math = built.math;
export const parseExpression = built.parse;

/** The engine's own evaluate (the script cannot reach it): parse, compile, run in a scope. */
export function evaluateExpression(expr: string, scope: Map<string, unknown> = new Map()): unknown {
  return parseExpression(expr).compile().evaluate(scope);
}

export function isUnit(x: unknown): x is Unit {
  return Boolean(x) && typeof x === "object" && (x as { type?: string }).type === "Unit";
}
