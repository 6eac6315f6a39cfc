import { parseBlock } from "../block/parse";
import type { BlockError, ParsedBlock } from "../block/types";
import { withParams } from "../block/with-params";
import { analyzeScript, type Statement } from "../script/analyze";
import { builtins, type SimHooks } from "../script/builtins";
import { fromQuantity } from "../units";

export type Prepared = { block: ParsedBlock | null; statements: Statement[]; errors: BlockError[]; slug: string };

/** Parse a block (with draft parameter values put in first) and its check script. */
export function prepare(text: string, params?: Record<string, string>): Prepared {
  let source = String(text ?? "");
  if (params && Object.keys(params).length) {
    try {
      source = withParams(source, params);
    } catch (e) {
      return { block: null, statements: [], errors: [{ message: (e as Error).message }], slug: slugGuess(source) };
    }
  }
  const { block, errors } = parseBlock(source);
  if (!block) return { block, statements: [], errors, slug: slugGuess(source) };
  const statements = analyzeScript(block.script, block.scriptLine, errors, block.params.map((p) => p.name));
  return { block, statements, errors, slug: block.slug };
}

/** The slug even from a file that does not parse, so an error report still names its block. */
function slugGuess(text: string): string {
  return /^slug:\s*["']?([a-z0-9-]+)/m.exec(text)?.[1] ?? "";
}

/** A fresh script scope: the built-ins, then the parameters as quantities (they win over unit names). */
export function scopeFor(block: ParsedBlock, values: Record<string, number>, hooks: SimHooks): Map<string, unknown> {
  const scope = builtins(hooks);
  // Read by the engine before any run (engine/script-facts.ts); as a statement it does nothing.
  scope.set("montecarlo", () => undefined);
  for (const p of block.params) scope.set(p.name, fromQuantity(values[p.name] ?? p.si, p.unit));
  return scope;
}

export const nominalValues = (block: ParsedBlock) => Object.fromEntries(block.params.map((p) => [p.name, p.si]));

// ngspice reads temperatures (.temp, temp=, TEMP) in °C; the script holds them in K.
const ABSOLUTE_ZERO_C = -273.15;

/** The values as the deck's .param lines hold them: SI, except temperatures in °C (358.15 K is 85). */
export function deckValues(block: ParsedBlock, values: Record<string, number>): Record<string, number> {
  const out = { ...values };
  for (const p of block.params) if (p.unit === "K" && p.name in out) out[p.name] = Number((out[p.name] + ABSOLUTE_ZERO_C).toPrecision(15));
  return out;
}

export const noSimulation: SimHooks = {
  simulate: () => {
    throw new Error("simulations run at nominal only");
  },
  measure: () => {
    throw new Error("simulations run at nominal only");
  },
  window: () => {},
  mark: () => {},
};
