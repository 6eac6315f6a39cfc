import type { BlockError } from "./block/types";
import { formatQuantity } from "./units";
import { readSpiceNumber } from "./spice-number";

const ANALYSIS = /^\.(tran|ac|dc|op|noise|tf|sens|pz|disto|four|fourier|meas|measure|print|plot|probe|save|width|end|lib|endl|alter|step|control|endc)\b/i;
const KEPT = /^\.(model|subckt|ends|param|func|ic|nodeset|temp|options|option|global|include|inc)\b/i;
const UNIT_BY_ELEMENT: Record<string, string> = { r: "ohm", c: "F", l: "H", v: "V", i: "A" };
// Default tolerances of common parts (common practice: 1 % film resistors, 5 % C0G/film capacitors, 10 % inductors).
const DEFAULT_TOL: Record<string, string> = { r: "1%", c: "5%", l: "10%" };

export type ImportedParam = { name: string; value: string; unit: string; tol?: string };

/**
 * An element's literal value becomes a parameter named after the element: `R1 in out 4.7k` → `R1 in out {R1}`.
 * Sources give their DC value (`V1 in 0 5`, `V1 in 0 DC 5 AC 1`); waveform sources (SIN, PULSE…) keep theirs.
 */
function lift(line: string, taken: Set<string>): { line: string; param?: { name: string; si: number; kind: string } } {
  const fields = line.trim().split(/\s+/);
  const kind = fields[0]?.[0]?.toLowerCase() ?? "";
  const name = fields[0] ?? "";
  if (!/^[A-Za-z_][A-Za-z0-9_]*$/.test(name) || taken.has(name.toLowerCase()) || !(kind in UNIT_BY_ELEMENT)) return { line };
  let at = 3;
  if (kind === "v" || kind === "i") {
    if (fields[3]?.toLowerCase() === "dc") at = 4;
    else if (fields[3] && !/^[-+.\d]/.test(fields[3])) return { line };
  }
  const si = fields[at] === undefined ? null : readSpiceNumber(fields[at]);
  if (si === null) return { line };
  // Parts must be positive; a zero or negative part value stays as written.
  if (kind in DEFAULT_TOL && !(si > 0)) return { line };
  const lead = line.match(/^\s*/)?.[0] ?? "";
  fields[at] = `{${name}}`;
  return { line: lead + fields.join(" "), param: { name, si, kind } };
}

/** Hand quantities the retune assistant can aim at: each RC pair's time constant, each LC pair's resonance. */
function handQuantities(circuit: string[], lifted: { name: string; kind: string }[]): string[] {
  const nodesOf = new Map<string, string[]>();
  for (const l of circuit) {
    const f = l.trim().split(/\s+/);
    if (f[0]) nodesOf.set(f[0], [f[1], f[2]].filter((n) => n && n !== "0" && n.toLowerCase() !== "gnd"));
  }
  const share = (a: string, b: string) => (nodesOf.get(a) ?? []).some((n) => (nodesOf.get(b) ?? []).includes(n));
  const out: string[] = [];
  const of = (k: string) => lifted.filter((p) => p.kind === k).map((p) => p.name);
  for (const r of of("r")) for (const c of of("c")) if (share(r, c)) out.push(`tau_${r}_${c} = ${r} * ${c} to s`);
  for (const l of of("l")) for (const c of of("c")) if (share(l, c)) out.push(`f_${l}_${c} = 1 / (2 pi sqrt(${l} * ${c})) to Hz`);
  return out.slice(0, 12);
}

function slugFrom(fileName: string | undefined, title: string): string {
  const base = (fileName ?? "").replace(/^.*[\\/]/, "").replace(/\.(cir|sp|spi|spice|net|ckt)$/i, "") || title;
  return base.toLowerCase().replace(/[^a-z0-9]+/g, "-").replace(/^-+|-+$/g, "").slice(0, 60) || "imported-netlist";
}

const yamlText = (s: string) => (/^[A-Za-z0-9][A-Za-z0-9 ._()+-]*$/.test(s) ? s : JSON.stringify(s));

/** Lines with "+" continuations joined; each keeps the file line it started on. */
function logicalLines(text: string): { text: string; line: number }[] {
  const out: { text: string; line: number }[] = [];
  text.split(/\r?\n/).forEach((raw, i) => {
    if (/^\+/.test(raw) && out.length) out[out.length - 1].text += " " + raw.slice(1).trim();
    else out.push({ text: raw.replace(/\s+$/, ""), line: i + 1 });
  });
  return out;
}

/** A SPICE netlist as a block file: .param values become typed parameters, analysis and control lines are dropped. */
export function importNetlist(text: string, fileName?: string): { blockText: string; dropped: string[]; errors: BlockError[]; params: ImportedParam[] } {
  const errors: BlockError[] = [];
  const lines = logicalLines(String(text ?? ""));
  const title = (lines.shift()?.text ?? "").replace(/^\*\s*/, "").trim() || "Imported netlist";
  const dropped: string[] = [];
  const params: { name: string; si: number; line: number }[] = [];
  const circuit: string[] = [];
  const script: string[] = [];
  let inControl = false;
  for (const { text: l, line } of lines) {
    const t = l.trim();
    if (inControl) {
      dropped.push(t);
      if (/^\.endc\b/i.test(t)) inControl = false;
      continue;
    }
    if (/^\.control\b/i.test(t)) {
      inControl = true;
      dropped.push(t);
      continue;
    }
    if (/^\.param\b/i.test(t)) {
      const rest: string[] = [];
      for (const m of t.replace(/^\.param\s*/i, "").matchAll(/([A-Za-z_]\w*)\s*=\s*(\{[^}]*\}|'[^']*'|\S+)/g)) {
        const v = readSpiceNumber(m[2]);
        if (v === null) rest.push(`${m[1]}=${m[2]}`);
        else params.push({ name: m[1], si: v, line });
      }
      if (rest.length) circuit.push(`.param ${rest.join(" ")}`);
      continue;
    }
    if (ANALYSIS.test(t)) {
      dropped.push(t);
      const call = scriptCall(t);
      if (call) script.push(call);
      continue;
    }
    if (t.startsWith(".") && !KEPT.test(t)) {
      dropped.push(t);
      errors.push({ message: `unknown dot command dropped: ${t.split(/\s+/)[0]}`, line });
      continue;
    }
    circuit.push(l);
  }
  const taken = new Set(params.map((p) => p.name.toLowerCase()));
  const lifted: { name: string; si: number; kind: string }[] = [];
  circuit.forEach((l, i) => {
    const r = lift(l, taken);
    if (!r.param) return;
    circuit[i] = r.line;
    taken.add(r.param.name.toLowerCase());
    lifted.push(r.param);
  });
  const seen = new Map<string, string>();
  for (const p of params) {
    const prev = seen.get(p.name.toLowerCase());
    if (prev !== undefined && prev !== p.name) errors.push({ message: `parameters "${prev}" and "${p.name}" differ only in case`, line: p.line });
    seen.set(p.name.toLowerCase(), p.name);
  }
  const unitOf = (name: string) => {
    const uses = new RegExp(`\\{\\s*${name}\\s*\\}|(^|\\s)${name}(\\s|$)`, "i");
    for (const l of circuit) {
      const fields = l.trim().split(/\s+/);
      const kind = fields[0]?.[0]?.toLowerCase() ?? "";
      if (UNIT_BY_ELEMENT[kind] && fields.slice(3).some((f) => uses.test(f))) return UNIT_BY_ELEMENT[kind];
    }
    return "";
  };
  const imported: ImportedParam[] = [
    ...params.map((p) => ({ name: p.name, value: formatQuantity(p.si, unitOf(p.name)), unit: unitOf(p.name) })),
    ...lifted.map((p) => ({ name: p.name, value: formatQuantity(p.si, UNIT_BY_ELEMENT[p.kind]), unit: UNIT_BY_ELEMENT[p.kind], ...(DEFAULT_TOL[p.kind] ? { tol: DEFAULT_TOL[p.kind] } : {}) })),
  ];
  const paramLines = imported.map(paramLine);
  const hasOp = script.some((l) => /= op\(\)$/.test(l));
  const hasAc = script.some((l) => /= ac\(/.test(l));
  const acSource = circuit.some((l) => /^\s*[vi]\S*\s+\S+\s+\S+.*\bac\b/i.test(l));
  const starter = [
    "# Written by the import: the operating point, the analyses the netlist asked for, and hand quantities to retune.",
    ...(hasOp ? [] : ["dc = op()"]),
    ...script,
    ...(acSource && !hasAc ? ["ac_res = ac(10 Hz, 1 MHz, 20)"] : []),
    ...handQuantities(circuit, lifted),
  ];
  const slug = slugFrom(fileName, title);
  const blockText = [
    "---",
    `slug: ${slug}`,
    `title: ${yamlText(title)}`,
    "category: other",
    "tags: [imported]",
    `summary: ${yamlText(`Imported from ${fileName ?? "a SPICE netlist"}`)}`,
    ...(paramLines.length ? ["params:", ...paramLines] : ["params: []"]),
    "---",
    `Imported from ${fileName ? `\`${fileName.replace(/`/g, "")}\`` : "a SPICE netlist"}. Each part value is a parameter with a default tolerance; add checks to the script.`,
    "",
    "```spice",
    ...circuit.filter((l, i) => !(i === 0 && l.trim() === "")),
    "```",
    "",
    "```check",
    ...starter,
    "```",
    "",
  ].join("\n");
  return { blockText, dropped, errors, params: imported };
}

/** One parameter as the block file writes it; the import form rewrites these lines when a value or tolerance is edited. */
export function paramLine(p: ImportedParam): string {
  return `  - { name: ${p.name}, value: ${p.value}${p.tol ? `, tol: ${p.tol}` : ""} }`;
}

/** The script call for a dropped analysis card, so the imported block still runs it. */
function scriptCall(card: string): string | null {
  const f = card.split(/\s+/);
  const n = (s: string | undefined) => (s === undefined ? null : readSpiceNumber(s));
  const kind = f[0].toLowerCase();
  if (kind === ".op") return "dc = op()";
  if (kind === ".tran") {
    const [step, stop] = [n(f[1]), n(f[2])];
    if (step === null || stop === null) return null;
    const uic = f.some((x) => x.toLowerCase() === "uic") ? ', "uic"' : "";
    return `res = tran(${formatQuantity(stop, "s")}, ${formatQuantity(step, "s")}${uic})`;
  }
  if (kind === ".ac" && f[1]?.toLowerCase() === "dec") {
    const [pts, f1, f2] = [n(f[2]), n(f[3]), n(f[4])];
    if (pts === null || f1 === null || f2 === null) return null;
    return `ac_res = ac(${formatQuantity(f1, "Hz")}, ${formatQuantity(f2, "Hz")}, ${pts})`;
  }
  return null;
}
