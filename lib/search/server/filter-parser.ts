import { errors } from "./errors";

// Meilisearch's filter expression grammar:
//   expression = or;  or = and ("OR" and)*;  and = not ("AND" not)*;
//   not = "NOT" not | primary;  primary = "(" expression ")" | condition
// so NOT binds tighter than AND, and AND tighter than OR.
export type Condition =
  | { op: "=" | "!=" | ">" | ">=" | "<" | "<="; attr: string; value: string }
  | { op: "TO"; attr: string; from: string; to: string }
  | { op: "IN"; attr: string; values: string[] }
  | { op: "EXISTS" | "NULL" | "EMPTY"; attr: string };

export type FilterNode =
  | { kind: "cond"; cond: Condition }
  | { kind: "not"; node: FilterNode }
  | { kind: "and" | "or"; nodes: FilterNode[] };

interface Tok {
  type: "word" | "quoted" | "punct";
  text: string;
  pos: number;
}

const PUNCT = /^(!=|>=|<=|=|>|<|\(|\)|\[|\]|,)/;

function lex(src: string): Tok[] {
  const toks: Tok[] = [];
  let i = 0;
  while (i < src.length) {
    const c = src[i];
    if (/\s/.test(c)) { i++; continue; }
    const p = PUNCT.exec(src.slice(i));
    if (p) { toks.push({ type: "punct", text: p[1], pos: i }); i += p[1].length; continue; }
    if (c === "'" || c === '"') {
      let j = i + 1;
      let text = "";
      while (j < src.length && src[j] !== c) {
        if (src[j] === "\\" && j + 1 < src.length) j++;
        text += src[j++];
      }
      if (j >= src.length) throw syntax(src, i, `Expression \`${src.slice(i)}\` is missing the closing quote ${c}.`);
      toks.push({ type: "quoted", text, pos: i });
      i = j + 1;
      continue;
    }
    let j = i;
    while (j < src.length && !/[\s()[\],=!<>'"]/.test(src[j])) j++;
    if (j === i) throw syntax(src, i, `Unexpected character \`${c}\`.`);
    toks.push({ type: "word", text: src.slice(i, j), pos: i });
    i = j;
  }
  return toks;
}

function syntax(src: string, pos: number, why: string) {
  return errors.invalidFilter(`${why}\n${pos + 1}:${src.length + 1} ${src}`);
}

class Parser {
  private i = 0;
  constructor(private src: string, private toks: Tok[]) {}

  parse(): FilterNode {
    const node = this.or();
    if (this.i < this.toks.length) throw this.fail("Found unexpected characters at the end of the filter");
    return node;
  }

  private peek(k = 0) { return this.toks[this.i + k]; }
  private isKw(t: Tok | undefined, kw: string) { return t?.type === "word" && t.text === kw; }
  private isPunct(t: Tok | undefined, p: string) { return t?.type === "punct" && t.text === p; }
  private fail(why: string) {
    const t = this.peek();
    return syntax(this.src, t ? t.pos : this.src.length, `${why}: expected a comparison (\`=\`, \`!=\`, \`>\`, \`>=\`, \`<\`, \`<=\`, \`TO\`, \`EXISTS\`, \`IS NULL\`, \`IS EMPTY\`, \`IN\`), \`NOT\`, \`AND\`, \`OR\` or parentheses.`);
  }

  private or(): FilterNode {
    const nodes = [this.and()];
    while (this.isKw(this.peek(), "OR")) { this.i++; nodes.push(this.and()); }
    return nodes.length === 1 ? nodes[0] : { kind: "or", nodes };
  }

  private and(): FilterNode {
    const nodes = [this.not()];
    while (this.isKw(this.peek(), "AND")) { this.i++; nodes.push(this.not()); }
    return nodes.length === 1 ? nodes[0] : { kind: "and", nodes };
  }

  private not(): FilterNode {
    if (this.isKw(this.peek(), "NOT")) { this.i++; return { kind: "not", node: this.not() }; }
    if (this.isPunct(this.peek(), "(")) {
      this.i++;
      const node = this.or();
      if (!this.isPunct(this.peek(), ")")) throw this.fail("Expression is missing a closing parenthesis");
      this.i++;
      return node;
    }
    return this.condition();
  }

  private value(): string {
    const t = this.peek();
    if (!t || t.type === "punct") throw this.fail("Was expecting a value");
    this.i++;
    return t.text;
  }

  private condition(): FilterNode {
    const a = this.peek();
    if (!a || a.type === "punct" || (a.type === "word" && ["AND", "OR"].includes(a.text))) throw this.fail("Was expecting an attribute");
    this.i++;
    const attr = a.text;
    const cond = (c: Condition): FilterNode => ({ kind: "cond", cond: c });
    const t = this.peek();
    if (t?.type === "punct" && ["=", "!=", ">", ">=", "<", "<="].includes(t.text)) {
      this.i++;
      return cond({ op: t.text as "=", attr, value: this.value() });
    }
    if (this.isKw(t, "EXISTS")) { this.i++; return cond({ op: "EXISTS", attr }); }
    if (this.isKw(t, "IN")) { this.i++; return cond({ op: "IN", attr, values: this.list() }); }
    if (this.isKw(t, "IS")) {
      this.i++;
      const negate = this.isKw(this.peek(), "NOT");
      if (negate) this.i++;
      const w = this.peek();
      if (!this.isKw(w, "NULL") && !this.isKw(w, "EMPTY")) throw this.fail("Was expecting NULL or EMPTY after IS");
      this.i++;
      const node = cond({ op: w!.text as "NULL", attr });
      return negate ? { kind: "not", node } : node;
    }
    if (this.isKw(t, "NOT")) {
      const w = this.peek(1);
      if (this.isKw(w, "EXISTS")) { this.i += 2; return { kind: "not", node: cond({ op: "EXISTS", attr }) }; }
      if (this.isKw(w, "IN")) { this.i += 2; return { kind: "not", node: cond({ op: "IN", attr, values: this.list() }) }; }
      throw this.fail("Was expecting EXISTS or IN after NOT");
    }
    if (t && t.type !== "punct" && this.isKw(this.peek(1), "TO")) {
      const from = this.value();
      this.i++;
      return cond({ op: "TO", attr, from, to: this.value() });
    }
    throw this.fail(`Was expecting an operation after \`${attr}\``);
  }

  private list(): string[] {
    if (!this.isPunct(this.peek(), "[")) throw this.fail("Was expecting an opening bracket after IN");
    this.i++;
    const values: string[] = [];
    while (!this.isPunct(this.peek(), "]")) {
      values.push(this.value());
      if (this.isPunct(this.peek(), ",")) this.i++;
      else if (!this.isPunct(this.peek(), "]")) throw this.fail("Expected a comma or a closing bracket in the IN list");
    }
    this.i++;
    return values;
  }
}

export function parseFilterString(src: string): FilterNode | null {
  if (src.trim() === "") return null;
  return new Parser(src, lex(src)).parse();
}

// The array form: outer elements are ANDed, an inner array is ORed.
export function parseFilter(filter: unknown): FilterNode | null {
  if (filter === undefined || filter === null) return null;
  if (typeof filter === "string") return parseFilterString(filter);
  if (!Array.isArray(filter)) throw errors.invalidFilter(`Invalid value type at \`.filter\`: expected a string or an array, but found ${typeof filter}`);
  const parts: FilterNode[] = [];
  for (const el of filter) {
    if (typeof el === "string") { const n = parseFilterString(el); if (n) parts.push(n); }
    else if (Array.isArray(el)) {
      const ors = el.map((s) => {
        if (typeof s !== "string") throw errors.invalidFilter("Invalid value in the filter array: nested arrays hold only strings.");
        return parseFilterString(s);
      }).filter((n): n is FilterNode => n !== null);
      if (ors.length) parts.push(ors.length === 1 ? ors[0] : { kind: "or", nodes: ors });
    } else throw errors.invalidFilter("Invalid value in the filter array: expected a string or an array of strings.");
  }
  if (parts.length === 0) return null;
  return parts.length === 1 ? parts[0] : { kind: "and", nodes: parts };
}

export function filterAttributes(node: FilterNode | null, out: string[] = []): string[] {
  if (!node) return out;
  if (node.kind === "cond") out.push(node.cond.attr);
  else if (node.kind === "not") filterAttributes(node.node, out);
  else node.nodes.forEach((n) => filterAttributes(n, out));
  return out;
}
