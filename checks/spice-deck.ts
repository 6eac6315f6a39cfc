import { parseBlock } from "./block/parse";
import { withParams } from "./block/with-params";
import { circuitRefusal } from "./spice/refusal";
import { SpiceError } from "./spice/types";
import { deckValues } from "./engine/prepare";
import { inlineIncludes, type InlineModel } from "./spice/model-file";

/**
 * The block as a SPICE deck for other tools: title, .param lines in SI numbers, the circuit with every included
 * model file inlined (`models`, by include name), the analysis cards the script ran (`analyses`), .end.
 */
export function spiceDeck(
  text: string,
  params?: Record<string, string>,
  opts: { models?: Record<string, InlineModel>; analyses?: string[] } = {},
): string {
  const source = params && Object.keys(params).length ? withParams(text, params) : text;
  const { block, errors } = parseBlock(source);
  if (!block) throw new Error(`the block file has errors: ${errors.map((e) => (e.line ? `line ${e.line}: ` : "") + e.message).join("; ")}`);
  // A deck is for running: never hand out one that the engine itself would refuse to run.
  const refused = circuitRefusal(block.netlist);
  if (refused) throw new SpiceError(`netlist: ${refused.message}`, refused.line === undefined ? undefined : block.netlistLine + refused.line - 1);
  const title = block.title.replace(/[\r\n]+/g, " ").trim();
  // The same numbers the engine's own decks carry (temperatures in °C).
  const values = deckValues(block, Object.fromEntries(block.params.map((p) => [p.name, p.si])));
  const lines = block.params.map((p) => `.param ${p.name}=${String(values[p.name])}`);
  const circuit = inlineIncludes(block.netlist.replace(/\s+$/, ""), opts.models ?? {});
  return [title, ...lines, circuit, ...(opts.analyses ?? []), ".end", ""].join("\n");
}
