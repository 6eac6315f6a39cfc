import type { MathNode } from "mathjs";
import { formatValue, toQuantity } from "../units";
import { isUnit, math } from "./math";
import { membersOf } from "./sweep";
import { UnitMismatch, logarithmicUnit, mismatchWhy, plainTypeMessage } from "./unit-rules";

export type Judged = {
  ok: boolean;
  text: string;
  /** Signed distance from the limit, relative: > 0 passes, < 0 fails; ranks tolerance corners. */
  margin: number;
  /** The first compared quantity and its limits, for the corner plot. */
  primary?: { label: string; value: unknown; limits: unknown[]; relations?: string[]; target?: unknown };
};

const RELATIONS: Record<string, { sym: string; test: (a: unknown, b: unknown) => boolean; dir: 1 | -1 | 0 }> = {
  smaller: { sym: "<", test: (a, b) => math.smaller(a as never, b as never) as unknown as boolean, dir: -1 },
  smallerEq: { sym: "≤", test: (a, b) => math.smallerEq(a as never, b as never) as unknown as boolean, dir: -1 },
  larger: { sym: ">", test: (a, b) => math.larger(a as never, b as never) as unknown as boolean, dir: 1 },
  largerEq: { sym: "≥", test: (a, b) => math.largerEq(a as never, b as never) as unknown as boolean, dir: 1 },
  equal: { sym: "==", test: (a, b) => math.equal(a as never, b as never) as unknown as boolean, dir: 0 },
  unequal: { sym: "!=", test: (a, b) => !math.equal(a as never, b as never), dir: 0 },
};

// Per parsed node, shared by every corner: compiling and classifying once keeps corners cheap.
const compiled = new WeakMap<MathNode, { evaluate: (scope: Map<string, unknown>) => unknown }>();
const operands = new WeakMap<MathNode, { literal: boolean; label: string }>();

type Primary = Judged["primary"];
/** Limits on the same quantity (fc > 1.5 kHz and fc < 3 kHz) belong on one plot. */
const merge = (a: Primary, b: Primary): Primary =>
  a && b && a.label === b.label
    ? { ...a, limits: [...a.limits, ...b.limits], relations: [...(a.relations ?? []), ...(b.relations ?? [])], target: a.target ?? b.target }
    : (a ?? b);

const mark = (ok: boolean) => (ok ? "✓" : "✗");

function si(x: unknown): number {
  const q = toQuantity(x);
  if (!q) throw new Error(`expected a number or a quantity, got ${formatValue(x)}`);
  return q.si;
}

/** Evaluates a check condition node by node, keeping each comparison's operands for the report. */
export class ConditionJudge {
  private shown = new Set<string>();
  /** text=false skips the detail text (tolerance corners need only pass/fail and margins). */
  constructor(private scope: Map<string, unknown>, private text = true) {}

  private value(n: MathNode): unknown {
    let c = compiled.get(n);
    if (!c) compiled.set(n, (c = n.compile()));
    return c.evaluate(this.scope);
  }

  /** A literal (only numbers and unit names) is shown as its value; anything else is named once. */
  private operand(n: MathNode, v: unknown): { text: string; label: string; literal: boolean } {
    let o = operands.get(n);
    if (!o) {
      const inner = n.type === "ParenthesisNode" ? (n as unknown as { content: MathNode }).content : n;
      let literal = true;
      inner.traverse((c) => {
        if (c.type === "SymbolNode" && this.scope.has((c as unknown as { name: string }).name)) literal = false;
        if (c.type === "FunctionNode") literal = false;
      });
      const label = inner.type === "SymbolNode" ? (inner as unknown as { name: string }).name : inner.toString();
      operands.set(n, (o = { literal, label }));
    }
    const { literal, label } = o;
    if (!this.text) return { text: "", label, literal };
    if (literal || this.shown.has(label)) return { text: formatValue(v), label, literal };
    this.shown.add(label);
    return { text: `${label} = ${formatValue(v)}`, label, literal };
  }

  judge(n: MathNode): Judged {
    if (n.type === "ParenthesisNode") return this.judge((n as unknown as { content: MathNode }).content);
    if (n.type === "OperatorNode") {
      const { fn, args } = n as unknown as { fn: string; args: MathNode[] };
      if (fn === "and" || fn === "or") {
        const a = this.judge(args[0]);
        const b = this.judge(args[1]);
        const ok = fn === "and" ? a.ok && b.ok : a.ok || b.ok;
        const margin = fn === "and" ? Math.min(a.margin, b.margin) : Math.max(a.margin, b.margin);
        return { ok, margin, text: this.text ? `${a.text} ${fn} ${b.text}` : "", primary: merge(a.primary, b.primary) };
      }
      if (fn === "not") {
        const a = this.judge(args[0]);
        return { ok: !a.ok, margin: -a.margin, text: this.text ? `not (${a.text})` : "", primary: a.primary };
      }
      if (RELATIONS[fn]) return this.relation(fn, args[0], args[1]);
    }
    if (n.type === "RelationalNode") {
      const { conditionals, params } = n as unknown as { conditionals: string[]; params: MathNode[] };
      const parts = conditionals.map((c, i) => this.relation(c, params[i], params[i + 1]));
      return {
        ok: parts.every((p) => p.ok),
        margin: Math.min(...parts.map((p) => p.margin)),
        text: this.text ? parts.map((p) => p.text).join(" and ") : "",
        primary: parts.map((p) => p.primary).reduce(merge),
      };
    }
    if (n.type === "FunctionNode" && (n as unknown as { fn: { name?: string } }).fn.name === "near") {
      const args = (n as unknown as { args: MathNode[] }).args;
      if (args.length === 3) return this.near(args[0], args[1], args[2]);
    }
    const v = this.value(n);
    if (typeof v !== "boolean") throw new Error(`the condition ${n.toString()} gives ${formatValue(v)}, not true or false`);
    return { ok: v, margin: v ? 1 : -1, text: this.text ? `${n.toString()} ${mark(v)}` : "" };
  }

  private relation(fn: string, ln: MathNode, rn: MathNode): Judged {
    const a = this.value(ln);
    const b = this.value(rn);
    if (isVector(a) || isVector(b)) return this.each(ln, RELATIONS[fn].sym, [a, b], ([x, y], quiet) => quiet.relationOf(fn, ln, rn, x, y));
    return this.relationOf(fn, ln, rn, a, b);
  }

  /**
   * A comparison on a sweep's family: judged member by member; it passes only if every member
   * passes, its margin is the least member's, and the text lists each member.
   */
  private each(ln: MathNode, sym: string, values: unknown[], judge: (v: unknown[], quiet: ConditionJudge) => Judged): Judged {
    const lists = values.map((v) => (isVector(v) ? (math.isMatrix(v) ? (v.toArray() as unknown[]) : (v as unknown[])) : null));
    const n = Math.max(...lists.map((l) => l?.length ?? 0));
    if (lists.some((l) => l && l.length !== n)) throw new Error(`cannot compare families of ${lists.map((l) => l?.length ?? 1).join(" and ")} members`);
    const names = values.map(membersOf).find(Boolean) ?? Array.from({ length: n }, (_, i) => `#${i + 1}`);
    const quiet = new ConditionJudge(this.scope, false);
    const parts = Array.from({ length: n }, (_, i) => judge(values.map((v, k) => (lists[k] ? lists[k]![i] : v)), quiet));
    const margin = Math.min(...parts.map((p) => (Number.isNaN(p.margin) ? -Infinity : p.margin)));
    const ok = parts.every((p) => p.ok);
    const label = (ln.type === "ParenthesisNode" ? (ln as unknown as { content: MathNode }).content : ln).toString();
    const first = parts[0]?.primary;
    const primary = first ? { ...first, label, value: values[0] } : undefined;
    if (!this.text) return { ok, margin, text: "", primary };
    const limit = values.slice(1).map((v) => (isVector(v) ? "each" : formatValue(v))).join(", ");
    const list = parts.map((p, i) => `${names[i]}: ${formatValue(lists[0] ? lists[0][i] : values[0])} ${mark(p.ok)}`).join(", ");
    return { ok, margin, text: `${label} ${sym} ${limit} for every member (${list}) ${mark(ok)}`, primary };
  }

  private relationOf(fn: string, ln: MathNode, rn: MathNode, a: unknown, b: unknown): Judged {
    const rel = RELATIONS[fn];
    let ok: boolean;
    try {
      ok = rel.test(a, b);
    } catch (e) {
      const why = e instanceof UnitMismatch ? e.why : plainTypeMessage((e as Error).message);
      throw new Error(`cannot compare ${ln.toString()} = ${formatValue(a)} with ${formatValue(b)}: ${why}`);
    }
    const [x, y] = [si(a), si(b)];
    const scale = Math.max(Math.abs(x), Math.abs(y)) || 1;
    const margin = rel.dir === 0 ? (ok ? 0 : -Math.abs(x - y) / scale) : (rel.dir * (x - y)) / scale;
    const left = this.operand(ln, a);
    const right = this.operand(rn, b);
    // The quantity on the left of its limit either way round: `1.5 kHz < fc` reads as fc > 1.5 kHz.
    const flip: Record<string, string> = { "<": ">", "≤": "≥", ">": "<", "≥": "≤" };
    const primary = left.literal && !right.literal
      ? { label: right.label, value: b, limits: [a], relations: [flip[rel.sym] ?? rel.sym] }
      : { label: left.label, value: a, limits: [b], relations: [rel.sym] };
    return { ok, margin, text: this.text ? `${left.text} ${rel.sym} ${right.text} ${mark(ok)}` : "", primary };
  }

  private near(xn: MathNode, tn: MathNode, toln: MathNode): Judged {
    const [x, t, tol] = [this.value(xn), this.value(tn), this.value(toln)];
    if (isVector(x) || isVector(t)) return this.each(xn, "≈", [x, t], ([a, b], quiet) => quiet.nearOf(xn, tn, a, b, tol));
    return this.nearOf(xn, tn, x, t, tol);
  }

  private nearOf(xn: MathNode, tn: MathNode, x: unknown, t: unknown, tol: unknown): Judged {
    const r = nearTest(x, t, tol);
    const left = this.operand(xn, x);
    const right = this.operand(tn, t);
    const margin = (r.tolAbs - Math.abs(r.x - r.target)) / (Math.abs(r.target) || r.tolAbs || 1);
    const primary = { label: left.label, value: x, limits: [r.target - r.tolAbs, r.target + r.tolAbs], relations: ["≥", "≤"], target: r.target };
    if (!this.text) return { ok: r.ok, margin, text: "", primary };
    const tolText = isUnit(tol) ? formatValue(tol) : `${formatValue((tol as number) * 100)}%`;
    const off = r.target !== 0 && Number.isFinite(r.x) ? ` (off by ${formatValue((100 * (r.x - r.target)) / Math.abs(r.target), 2)}%)` : "";
    return { ok: r.ok, margin, text: `${left.text} ≈ ${right.text} ± ${tolText} ${mark(r.ok)}${off}`, primary };
  }
}

const isVector = (x: unknown) => math.isMatrix(x) || Array.isArray(x);

/** near(x, target, tol): tol with units is absolute, a plain number relative to |target|. */
export function nearTest(x: unknown, target: unknown, tol: unknown) {
  // dB and deg beside a plain number: the number is in dB (degrees).
  const log = logarithmicUnit(x) ?? logarithmicUnit(target);
  if (log && typeof x === "number") x = math.unit(x, log);
  if (log && typeof target === "number") target = math.unit(target, log);
  const why = mismatchWhy(x, target);
  if (why) throw new Error(`near(): cannot compare ${formatValue(x)} with ${formatValue(target)}: ${why}`);
  const [xs, ts] = [si(x), si(target)];
  let tolAbs: number;
  if (isUnit(tol)) {
    if (!isUnit(target) || !(tol as { equalBase(u: unknown): boolean }).equalBase(target))
      throw new Error(`near(): the tolerance ${formatValue(tol)} (${toQuantity(tol)!.unit || "plain"}) is not in the unit of ${formatValue(target)} (${toQuantity(target)?.unit || "a plain number"})`);
    tolAbs = si(tol);
  } else if (typeof tol === "number") tolAbs = Math.abs(tol * ts);
  else throw new Error("near(): the tolerance must be a number (relative, e.g. 2%) or a quantity (absolute)");
  return { ok: Math.abs(xs - ts) <= tolAbs * (1 + 1e-12), x: xs, target: ts, tolAbs };
}
