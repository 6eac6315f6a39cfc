import { SpiceError } from "./types";

// ngspice maps an E/G `TABLE` source onto a code model of its analog library, which the engine
// does not load (the same library holds models that read files). The same lookup is a B source:
// `E1 n+ n- TABLE {x} = (x0,y0) (x1,y1) …` becomes `BE1 n+ n- V = pwl(min(max(x, x0), xN), x0,y0, …)`,
// clamped at the ends as a TABLE is (pwl alone would extrapolate).
const TABLE = /^([eg]\S*)\s+(\S+)\s+(\S+)\s+table\s*(\{[^}]*\}|\S+)\s*=?\s*(.*)$/i;
const PAIR = /\(\s*([^,\s()]+)\s*[,\s]\s*([^,\s()]+)\s*\)/g;

/** The B-source line for a TABLE source written over `text` (its continuation lines joined). */
export function tableAsPwl(text: string, line: number): string {
  const m = TABLE.exec(text.replace(/\s+/g, " ").trim());
  if (!m) throw new SpiceError("a TABLE source reads `E1 n+ n- TABLE {expression} = (x0, y0) (x1, y1) …`", line);
  const [, name, plus, minus, expr, rest] = m;
  const points = [...rest.matchAll(PAIR)].map((p) => [p[1], p[2]]);
  if (points.length < 2) throw new SpiceError(`"${name}": a TABLE needs at least two (x, y) points`, line);
  const x = expr.replace(/^\{|\}$/g, "");
  const [x0, xN] = [points[0][0], points[points.length - 1][0]];
  const kind = name[0].toLowerCase() === "e" ? "V" : "I";
  return `B${name} ${plus} ${minus} ${kind} = pwl(min(max(${x}, ${x0}), ${xN}), ${points.map((p) => p.join(", ")).join(", ")})`;
}
