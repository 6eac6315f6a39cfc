import { Lexer, type YAMLError } from "yaml";

// The YAML library reports one mistake as several errors, in its own terms ("Nested mappings are not allowed in
// compact mappings"), at the place it gave up rather than where the mistake is. A person editing a block file wants
// one sentence at the line to fix: this picks the error that says most, finds that line, and words it plainly.

export type PlainYamlError = { message: string; /** Line in the YAML text, counted from 1. */ line: number };

const indentOf = (s: string) => /^[ \t]*/.exec(s)![0].length;
const keyOf = (s: string) => /^\s*(?:-\s+)?([A-Za-z_][\w-]*)\s*:/.exec(s)?.[1];
/** Characters of `line` outside quotes, so a quoted "[" or "{" is not counted as an opening. */
const unquoted = (line: string) => line.replace(/"(?:[^"\\]|\\.)*"|'(?:[^']|'')*'/g, "");

/** The top-level key a line belongs to ("params" for a parameter's line), or undefined for a top-level line. */
function sectionOf(lines: string[], i: number): string | undefined {
  if (indentOf(lines[i] ?? "") === 0) return undefined;
  for (let j = i - 1; j >= 0; j--) {
    if (lines[j].trim() && indentOf(lines[j]) === 0) return keyOf(lines[j]);
  }
  return undefined;
}

/** "the parameter's "value"", "the "title"" or "this line": what the line at index `i` holds, for a sentence's subject. */
function subject(lines: string[], i: number): string {
  const key = keyOf(lines[i] ?? "");
  const section = sectionOf(lines, i);
  if (section === "params") return key ? `the parameter's "${key}"` : "this parameter line";
  return key ? `"${key}"` : "this line";
}

const TAB = "a tab indents this line; indent with spaces only";

/** A line out of step with the one above; a tab among its leading blanks is the usual reason, so say that instead. */
const misindented = (lines: string[], i: number): PlainYamlError => ({
  line: i + 1,
  message: /^[ ]*\t/.test(lines[i] ?? "") ? TAB : `${subject(lines, i)} is indented differently from the line above`,
});

/** Whether a quoted scalar's source ends with its closing quote (not an escaped one: \" in double, '' in single quotes). */
function closed(token: string, q: string): boolean {
  const body = token.slice(1);
  if (!body.endsWith(q)) return false;
  const escape = q === '"' ? "\\" : "'";
  let n = 0;
  for (let i = body.length - 2; i >= 0 && body[i] === escape; i--) n++;
  return n % 2 === 0;
}

/**
 * The offset where a quote of kind `q` opens and never closes, from the library's own lexer (its tokens are the
 * source text, apart from one-character control tokens), or null when it finds none.
 */
function unclosedQuote(src: string, q: string): number | null {
  let offset = 0;
  for (const token of new Lexer().lex(src)) {
    if (token.length === 1 && token < " " && token !== "\n" && token !== "\t") continue;
    if (token[0] === q && !closed(token, q)) return offset;
    offset += token.length;
  }
  return null;
}

/** The line (index) at or above `from` that opens more `open` than it closes. */
function openingBracket(lines: string[], from: number, open: string, close: string): number {
  for (let j = Math.min(from, lines.length - 1); j >= 0; j--) {
    const s = unquoted(lines[j]);
    if (s.split(open).length > s.split(close).length) return j;
  }
  return from;
}

/**
 * One plain sentence for a YAML text that did not parse, at the line to fix (counted from 1 in `src`).
 * `lineOf` turns an offset in `src` into its line (the parser's own line counter).
 */
export function plainYamlError(errors: readonly YAMLError[], src: string, lineOf: (offset: number) => number): PlainYamlError {
  const lines = src.split("\n");
  // A key that runs over two lines explains the "nested mapping" error reported beside it, so it speaks first.
  const e = errors.find((x) => x.code === "MULTILINE_IMPLICIT_KEY") ?? errors[0];
  const at = lineOf(e.pos[0]) - 1;
  const first = e.message.split("\n")[0].replace(/\s+at line \d+, column \d+:?$/, "");

  switch (e.code) {
    case "TAB_AS_INDENT":
      return { line: at + 1, message: TAB };
    case "DUPLICATE_KEY": {
      const key = keyOf(lines[at] ?? "") ?? /^\s*(?:-\s+)?([^:\s]+)/.exec(src.slice(e.pos[0]))?.[1];
      return { line: at + 1, message: `${key ? `"${key}"` : "this key"} is given a second time; each key may appear once` };
    }
    case "MISSING_CHAR": {
      const quote = /closing (["'])/.exec(first)?.[1];
      if (quote) {
        const open = unclosedQuote(src, quote);
        return { line: open === null ? at + 1 : lineOf(open), message: `the ${quote === '"' ? "double" : "single"} quote opened on this line is never closed` };
      }
      if (/without - indicator/.test(first)) return misindented(lines, at);
      break;
    }
    case "BAD_INDENT": {
      const flow = /Flow (map|sequence)/.exec(first)?.[1];
      if (flow) {
        const [open, close] = flow === "map" ? ["{", "}"] : ["[", "]"];
        const j = openingBracket(lines, at, open, close);
        return { line: j + 1, message: `the "${open}" opened on this line is never closed with "${close}"` };
      }
      return misindented(lines, at);
    }
    case "MULTILINE_IMPLICIT_KEY": {
      // Either the key's line has no ":" at all, or the next line is indented under a line that holds a value.
      if (!/:(\s|$)/.test(unquoted(lines[at] ?? ""))) return { line: at + 1, message: `this line needs a ":" between the key and its value` };
      const end = lineOf(e.pos[1]) - 1;
      for (let j = at + 1; j <= end && j < lines.length; j++) if (lines[j].trim()) return misindented(lines, j);
      return misindented(lines, at);
    }
    case "BLOCK_AS_IMPLICIT_KEY":
      return { line: at + 1, message: `this value holds ": " a second time; put the whole value in quotes` };
    case "BAD_SCALAR_START":
      return { line: at + 1, message: "a value cannot start with this character; put the whole value in quotes" };
    case "BAD_DQ_ESCAPE":
      return { line: at + 1, message: 'a backslash in double quotes starts an unknown escape; use single quotes or write "\\\\"' };
    case "BAD_ALIAS":
    case "ALIAS_PROPS":
      return { line: at + 1, message: 'a value starting with "*" or "&" reads as a YAML reference; put the whole value in quotes' };
    default:
      break;
  }
  return { line: at + 1, message: first.charAt(0).toLowerCase() + first.slice(1) };
}
