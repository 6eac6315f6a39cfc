import type { MathJsInstance, Unit } from "mathjs";
import { formatValue, unitName } from "../units";

// Units as engineers use them in check scripts (DESIGN.md "Check scripts"):
// - dB and deg are dimensionless: a plain number beside one is read in dB (or degrees), so
//   `gain_db(res, "out", f0) > 15` and `phase(res, "out", f) - 90` mean what they say;
// - a comparison or sum of two different dimensions fails with one message naming both units,
//   never mathjs's list of accepted argument types.

const LOGARITHMIC = ["dB", "deg"];
const VERBS: Record<string, string> = {
  add: "add", subtract: "subtract", smaller: "compare", smallerEq: "compare", larger: "compare",
  largerEq: "compare", equal: "compare", unequal: "compare", compare: "compare",
};
const ARITHMETIC = new Set(["add", "subtract"]);

/** A unit mismatch; `why` is the part a caller that already shows the operands can use alone. */
export class UnitMismatch extends Error {
  constructor(verb: string, a: unknown, b: unknown, readonly why: string) {
    super(`cannot ${verb} ${formatValue(a)} ${verb === "compare" ? "with" : "and"} ${formatValue(b)}: ${why}`);
    this.name = "UnitMismatch";
  }
}

const isUnit = (x: unknown): x is Unit => Boolean(x) && typeof x === "object" && (x as { type?: string }).type === "Unit";

/** "dB" or "deg" when x is a quantity in one of them, else null. */
export function logarithmicUnit(x: unknown): string | null {
  if (!isUnit(x)) return null;
  const name = unitName(x);
  return LOGARITHMIC.includes(name) ? name : null;
}

const named = (x: unknown) => (isUnit(x) ? unitName(x) || "a plain ratio" : "a plain number");

export function mismatchWhy(a: unknown, b: unknown): string | null {
  const [ua, ub] = [isUnit(a), isUnit(b)];
  if (ua && ub && !(a as Unit).equalBase(b as Unit)) return `${named(a)} and ${named(b)} are different dimensions`;
  if (ua !== ub && (typeof a === "number" || typeof b === "number"))
    return `${named(ua ? a : b)} against a plain number; give the number a unit`;
  return null;
}

export function unitRules(math: MathJsInstance): Record<string, (...args: unknown[]) => unknown> {
  const fns = math as unknown as Record<string, (...args: unknown[]) => unknown>;
  const wrapped: Record<string, (...args: unknown[]) => unknown> = {};
  for (const [name, verb] of Object.entries(VERBS)) {
    const original = fns[name];
    wrapped[name] = (...args: unknown[]) => {
      if (args.length !== 2) return original(...args);
      const [a, b] = args;
      const log = logarithmicUnit(a) ?? logarithmicUnit(b);
      if (log && (typeof a === "number" || typeof b === "number")) {
        const x = typeof a === "number" ? a : (a as Unit).toNumber(log);
        const y = typeof b === "number" ? b : (b as Unit).toNumber(log);
        const r = original(x, y);
        return ARITHMETIC.has(name) ? math.unit(r as number, log) : r;
      }
      try {
        return original(a, b);
      } catch (e) {
        const why = mismatchWhy(a, b);
        if (why) throw new UnitMismatch(verb, a, b, why);
        throw e;
      }
    };
  }
  return wrapped;
}

/** mathjs's argument-type complaint in words: which function, which argument, what it got. */
export function plainTypeMessage(message: string): string {
  const m = /Unexpected type of argument in function (\w+) \(expected: .*?, actual: (\w+), index: (\d+)\)/.exec(message);
  if (!m) return message;
  const got: Record<string, string> = { number: "a plain number", Unit: "a quantity with a unit", string: "a string", boolean: "true or false" };
  return `${m[1]}() cannot take ${got[m[2]] ?? `a ${m[2]}`} as argument ${Number(m[3]) + 1}`;
}
