import { all, create, type MathJsInstance, type MathNode, type Unit } from "mathjs";

// One restricted mathjs instance for the whole engine, built once per process.
// Following the mathjs security notes: keep private references to parse/compile for
// the engine, then override the functions that let a script reach the parser, define
// units or rewrite the instance.
function build(): { math: MathJsInstance; parse: (expr: string) => MathNode } {
  const math = create(all, { number: "number", precision: 64 });
  // Decibels are a unit of their own so that `gain_db(...) > -3 dB` reads right and a
  // bare number compared to dB is refused rather than silently accepted.
  math.createUnit("dB");
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
