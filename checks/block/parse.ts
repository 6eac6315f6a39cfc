import { isMap, isScalar, isSeq, type Node } from "yaml";
import { findFences, withoutFences } from "./fences";
import { readFrontmatter } from "./frontmatter";
import { readParams } from "./params";
import { CATEGORIES, HAZARDS, SLUG_RULE, type BlockError, type ParsedBlock } from "./types";

const KEYS = new Set(["slug", "title", "category", "tags", "summary", "params", "hazard"]);

/** Parse a block file (DESIGN.md "Block file format"). `block` is null whenever there is an error. */
export function parseBlock(text: string): { block: ParsedBlock | null; errors: BlockError[] } {
  const errors: BlockError[] = [];
  const fm = readFrontmatter(String(text ?? ""), errors);
  if (!fm) return { block: null, errors };
  if (errors.length) return { block: null, errors };
  const root = fm.doc.contents as Node | null;
  const lineOf = (n: Node | null | undefined) => (n?.range ? fm.lineAt(n.range[0]) : 1);
  if (!isMap(root)) {
    errors.push({ message: "the frontmatter must be a map of keys (slug, title, category, …)", line: 2 });
    return { block: null, errors };
  }
  for (const p of root.items) {
    const k = isScalar(p.key) ? String(p.key.value) : "";
    if (!KEYS.has(k)) errors.push({ message: `unknown frontmatter key "${k}"`, line: lineOf(p.key as Node) });
  }
  const get = (k: string) => root.get(k, true) as Node | undefined;
  const text1 = (k: string, required = true): string => {
    const n = get(k);
    if (n == null || (isScalar(n) && (n.value === null || String(n.value).trim() === ""))) {
      if (required) errors.push({ message: `missing required field "${k}"`, line: n ? lineOf(n) : 2 });
      return "";
    }
    if (!isScalar(n) || typeof n.value === "object") {
      errors.push({ message: `"${k}" must be a single line of text`, line: lineOf(n) });
      return "";
    }
    return String(n.value).trim();
  };
  const list = (k: string, allowed?: string[]): string[] => {
    const n = get(k);
    if (n == null) return [];
    if (!isSeq(n)) {
      errors.push({ message: `"${k}" must be a list, e.g. [a, b]`, line: lineOf(n) });
      return [];
    }
    const out: string[] = [];
    for (const it of n.items as Node[]) {
      const v = isScalar(it) && it.value !== null ? String(it.value).trim() : "";
      if (!v) errors.push({ message: `"${k}" holds an empty or non-text item`, line: lineOf(it) });
      else if (allowed && !allowed.includes(v))
        errors.push({ message: `unknown ${k} "${v}" (use one of ${allowed.join(", ")})`, line: lineOf(it) });
      else out.push(v);
    }
    return out;
  };
  const slug = text1("slug");
  if (slug && !SLUG_RULE.test(slug))
    errors.push({ message: `slug "${slug}" may hold only lowercase letters, digits and single dashes`, line: lineOf(get("slug")) });
  const title = text1("title");
  const category = text1("category");
  if (category && !CATEGORIES.includes(category))
    errors.push({ message: `unknown category "${category}" (use one of ${CATEGORIES.join(", ")})`, line: lineOf(get("category")) });
  const summary = text1("summary");
  const tags = list("tags");
  const hazard = list("hazard", HAZARDS);
  const params = readParams(get("params"), lineOf, errors);

  const fences = findFences(fm.body, fm.bodyLine, errors);
  const pick = (info: string) => {
    const found = fences.filter((f) => f.info === info);
    for (const extra of found.slice(1)) errors.push({ message: `more than one \`\`\`${info} fence`, line: extra.line - 1 });
    return found[0];
  };
  const spice = pick("spice");
  const check = pick("check");
  if (errors.length) return { block: null, errors };
  return {
    block: {
      slug, title, category, tags, summary, hazard, params,
      body: fm.body,
      note: withoutFences(fm.body, [spice, check].filter((f) => f !== undefined)),
      netlist: spice?.content ?? "",
      script: check?.content ?? "",
      netlistLine: spice?.line ?? 0,
      scriptLine: check?.line ?? 0,
    },
    errors,
  };
}
