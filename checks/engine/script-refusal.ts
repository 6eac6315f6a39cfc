import type { BlockError, ParsedBlock } from "../block/types";
import { analyzeScript } from "../script/analyze";

/**
 * The first line of a block's check script that cannot be read at all (a syntax error, a refused call), on its
 * line in the block file. A file with such a line is not stored: it could only ever earn an `error` badge, and
 * storing it would move the head past a version that works.
 */
export function scriptRefusal(block: ParsedBlock): BlockError | null {
  const errors: BlockError[] = [];
  analyzeScript(block.script, block.scriptLine, errors, block.params.map((p) => p.name));
  return errors[0] ?? null;
}
