import { LineCounter, parseDocument, type Document } from "yaml";
import type { BlockError } from "./types";
import { plainYamlError } from "./yaml-errors";

export type Frontmatter = {
  doc: Document;
  /** Offset of the YAML text inside the block file. */
  offset: number;
  /** File line of a YAML offset (counted from 1). */
  lineAt: (yamlOffset: number) => number;
  body: string;
  /** File line on which the body starts. */
  bodyLine: number;
};

const FENCE = /^---[ \t]*$/;

/** Split "---\nYAML\n---\nbody" and parse the YAML, keeping positions for error lines. */
export function readFrontmatter(text: string, errors: BlockError[]): Frontmatter | null {
  const src = text.replace(/^\uFEFF/, "");
  const bom = text.length - src.length;
  const lines = src.split("\n");
  if (!FENCE.test(lines[0]?.replace(/\r$/, "") ?? "")) {
    errors.push({ message: 'the file must start with a "---" line opening the frontmatter', line: 1 });
    return null;
  }
  const close = lines.findIndex((l, i) => i > 0 && FENCE.test(l.replace(/\r$/, "")));
  if (close < 0) {
    errors.push({ message: 'the frontmatter has no closing "---" line', line: 1 });
    return null;
  }
  const offset = bom + lines[0].length + 1;
  const yamlText = lines.slice(1, close).join("\n");
  const counter = new LineCounter();
  const doc = parseDocument(yamlText, { lineCounter: counter, prettyErrors: false, uniqueKeys: true });
  const lineAt = (o: number) => counter.linePos(o).line + 1;
  // One sentence for the first mistake, at its line in the file: the parser's other errors follow from it.
  if (doc.errors.length) {
    const plain = plainYamlError(doc.errors, yamlText, (o) => counter.linePos(o).line);
    errors.push({ message: plain.message, line: plain.line + 1 });
  }
  const bodyStart = bom + lines.slice(0, close + 1).join("\n").length + 1;
  return { doc, offset, lineAt, body: text.slice(bodyStart), bodyLine: close + 2 };
}
