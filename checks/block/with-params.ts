import { isMap, isScalar, isSeq, type Node, type Scalar, type YAMLMap } from "yaml";
import { readQuantity } from "../units";
import { readFrontmatter } from "./frontmatter";
import { notPositive } from "./params";
import type { BlockError } from "./types";

const PLAIN = /^[A-Za-z0-9.+\-_(][A-Za-z0-9 .+\-\/%^*()_]*$/;

/** A YAML scalar that reads back as `value`, keeping the original quote style when there was one. */
function scalarSource(value: string, original: string): string {
  if (original.startsWith("'")) return `'${value.replace(/'/g, "''")}'`;
  if (original.startsWith('"') || !PLAIN.test(value) || value.endsWith(" ") || / #|: /.test(value)) return JSON.stringify(value);
  return value;
}

/**
 * The same block file with new parameter values (and optionally slug/title); every other
 * byte is left as it was, so diffs between versions show only what changed.
 */
export function withParams(text: string, params: Record<string, string>, meta: { slug?: string; title?: string } = {}): string {
  const errors: BlockError[] = [];
  const fm = readFrontmatter(text, errors);
  if (!fm || errors.length) throw new Error(`the block file cannot be read: ${errors[0]?.message ?? "no frontmatter"}`);
  const root = fm.doc.contents as Node | null;
  if (!isMap(root)) throw new Error("the frontmatter is not a map of keys");
  const edits: { node: Scalar; value: string }[] = [];
  const seq = root.get("params", true) as Node | undefined;
  const byName = new Map<string, YAMLMap>();
  if (isSeq(seq)) for (const it of seq.items as Node[]) if (isMap(it)) byName.set(String((it as YAMLMap).get("name")), it as YAMLMap);
  for (const [name, value] of Object.entries(params)) {
    const entry = byName.get(name);
    if (!entry) throw new Error(`unknown parameter "${name}"`);
    const node = entry.get("value", true) as Node | undefined;
    if (!isScalar(node) || !node.range) throw new Error(`parameter "${name}" has no value to replace`);
    const next = readQuantity(value);
    const before = readQuantity(String(node.value));
    if (next.unit !== before.unit)
      throw new Error(`parameter "${name}" is in ${before.unit || "plain numbers"}; "${value}" is in ${next.unit || "plain numbers"}`);
    const negative = notPositive(name, value, next);
    if (negative) throw new Error(negative);
    edits.push({ node, value: String(value).trim() });
  }
  for (const key of ["slug", "title"] as const) {
    if (meta[key] === undefined) continue;
    const node = root.get(key, true) as Node | undefined;
    if (!isScalar(node) || !node.range) throw new Error(`the frontmatter has no ${key} to replace`);
    if (/[\r\n]/.test(meta[key]!)) throw new Error(`${key} must be a single line`);
    edits.push({ node, value: meta[key]! });
  }
  let out = text;
  edits.sort((a, b) => b.node.range![0] - a.node.range![0]);
  for (const { node, value } of edits) {
    const [start, end] = node.range!;
    const from = fm.offset + start;
    const to = fm.offset + end;
    out = out.slice(0, from) + scalarSource(value, text.slice(from, to)) + out.slice(to);
  }
  return out;
}
