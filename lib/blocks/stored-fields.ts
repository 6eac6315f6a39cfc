import type { ParsedBlock } from "@/checks";
import { AppError } from "@/lib/errors";

// What the database can hold, checked before it is asked: PostgreSQL text refuses U+0000, and the block's
// slug and title columns have lengths. Each refusal names the field (and its line in the file).
const LIMITS = { slug: 100, title: 200 } as const;

function lineOf(text: string, index: number): number {
  return text.slice(0, index).split("\n").length;
}

function fieldAt(block: ParsedBlock, text: string, index: number): string {
  const line = lineOf(text, index);
  if (block.netlistLine && line >= block.netlistLine && line < block.netlistLine + block.netlist.split("\n").length) return "netlist";
  if (block.scriptLine && line >= block.scriptLine && line < block.scriptLine + block.script.split("\n").length) return "script";
  const key = /^([a-z]+):/.exec(text.split("\n")[line - 1] ?? "")?.[1];
  const inFrontMatter = text.startsWith("---") && text.indexOf("\n---", 3) > index;
  return inFrontMatter ? key ?? "frontmatter" : "note";
}

/** 422 naming the field when a block file holds what the database cannot store. */
export function assertStorable(block: ParsedBlock, text: string): void {
  const nul = text.indexOf("\u0000");
  if (nul >= 0) {
    const field = fieldAt(block, text, nul);
    const line = lineOf(text, nul);
    throw new AppError("validation", `${field}: must not contain the NUL character (U+0000) (line ${line})`, {
      errors: [{ path: field, message: "must not contain the NUL character (U+0000)", line }],
    });
  }
  for (const [field, max] of Object.entries(LIMITS) as [keyof typeof LIMITS, number][]) {
    if (block[field].length <= max) continue;
    const line = lineOf(text, Math.max(0, text.search(new RegExp(`^${field}:`, "m"))));
    throw new AppError("validation", `${field}: at most ${max} characters (this one has ${block[field].length}) (line ${line})`, {
      errors: [{ path: field, message: `at most ${max} characters`, line }],
    });
  }
}
