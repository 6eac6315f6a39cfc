import type { BlockError } from "./block/types";
import { formatQuantity } from "./units";
import { readSpiceNumber } from "./spice-number";

const ANALYSIS = /^\.(tran|ac|dc|op|noise|tf|sens|pz|disto|four|fourier|meas|measure|print|plot|probe|save|width|end|lib|endl|alter|step|control|endc)\b/i;
const KEPT = /^\.(model|subckt|ends|param|func|ic|nodeset|temp|options|option|global|include|inc)\b/i;
const UNIT_BY_ELEMENT: Record<string, string> = { r: "ohm", c: "F", l: "H", v: "V", i: "A" };

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
export function importNetlist(text: string, fileName?: string): { blockText: string; dropped: string[]; errors: BlockError[] } {
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
  const paramLines = params.map((p) => `  - { name: ${p.name}, value: ${formatQuantity(p.si, unitOf(p.name))} }`);
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
    `Imported from ${fileName ? `\`${fileName.replace(/`/g, "")}\`` : "a SPICE netlist"}. Add tolerances to the parameters and checks to the script.`,
    "",
    "```spice",
    ...circuit.filter((l, i) => !(i === 0 && l.trim() === "")),
    "```",
    "",
    "```check",
    ...script,
    "```",
    "",
  ].join("\n");
  return { blockText, dropped, errors };
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
