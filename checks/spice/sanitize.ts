import fs from "node:fs";
import path from "node:path";
import { defaultModelsDir } from "./paths";
import { SpiceError } from "./types";

// DESIGN.md "Block file format": what a block circuit may hold. Everything else is refused
// before ngspice runs, because ngspice can run commands, read files and write output.
const ALLOWED_CARDS = new Set([
  ".model", ".subckt", ".ends", ".param", ".func", ".ic", ".nodeset", ".temp",
  ".options", ".option", ".opt", ".global", ".include", ".inc",
]);
const ANALYSIS_CARDS = new Set([
  ".tran", ".ac", ".op", ".dc", ".noise", ".tf", ".sens", ".pz", ".disto", ".four",
  ".meas", ".measure", ".pss", ".sp",
]);
const OUTPUT_CARDS = new Set([".save", ".print", ".plot", ".probe", ".width", ".csparam"]);
// Numerical options only: `.options` values also become ngspice front-end variables
// (e.g. filetype), so an open list would let a netlist change how the runner reads results.
const ALLOWED_OPTIONS = new Set([
  "abstol", "reltol", "vntol", "chgtol", "trtol", "gmin", "gminsteps", "srcsteps", "itl1", "itl2",
  "itl3", "itl4", "itl5", "itl6", "method", "maxord", "pivtol", "pivrel", "rshunt", "cshunt", "temp",
  "tnom", "noopiter", "xmu", "defad", "defas", "defl", "defw", "seed", "interp", "maxstep", "ramptime",
]);
// Element letters ngspice knows without XSPICE code models or OSDI.
const ELEMENTS = "bcdefghijklmoqrstuvwxyz";
const LIB_FILE = /^[A-Za-z0-9][A-Za-z0-9_-]*\.lib$/;

const ALLOWED_TEXT = "element lines, .model, .subckt/.ends, .param, .func, .ic, .nodeset, .temp, .options, .global and .include NAME.lib";

/** Strip ngspice inline comments (`;` anywhere, `$` after white space). */
function code(line: string): string {
  return line.replace(/;.*$/, "").replace(/(^|\s)\$.*$/, "").trim();
}

/**
 * Check a block circuit line by line and return it with `.include NAME.lib` resolved to the
 * model library's absolute path. Line count is kept, so ngspice's line numbers map back.
 */
export function sanitizeNetlist(circuit: string, modelsDir = defaultModelsDir()): string {
  const lines = circuit.replace(/\r\n?/g, "\n").split("\n");
  const out: string[] = [];
  let card = ""; // the card a `+` continuation belongs to
  lines.forEach((raw, i) => {
    const line = i + 1;
    const text = code(raw);
    if (text === "" || text.startsWith("*")) return void out.push(raw);
    const first = text.split(/[\s(=]/, 1)[0].toLowerCase();
    if (first === "shell") throw new SpiceError("`shell` is not allowed in a block circuit", line);
    if (text.startsWith("+")) {
      if (card === ".include" || card === ".inc") throw new SpiceError("an .include line cannot be continued", line);
      if (card === ".options" || card === ".option" || card === ".opt") checkOptions(text.slice(1), line);
      return void out.push(raw);
    }
    card = first;
    if (first.startsWith(".")) return void out.push(checkCard(first, text, raw, line, modelsDir));
    if (first[0] === "a")
      throw new SpiceError(`XSPICE code-model instance "${first}" (A element) is not allowed: code models are not loaded, and some read files`, line);
    if ((first[0] === "e" || first[0] === "g") && /\btable\b/i.test(text))
      throw new SpiceError(
        `"${first}": a TABLE source needs ngspice's analog code-model library, which also holds models that read files; write it as a B source with pwl(), e.g. B${first.slice(1)} out 0 V = pwl(V(in), 0, 0, 1, 1.5)`,
        line,
      );
    if (!ELEMENTS.includes(first[0]))
      throw new SpiceError(`"${first}" is not a SPICE element line; a block circuit holds ${ALLOWED_TEXT}`, line);
    out.push(raw);
  });
  return out.join("\n");
}

function checkCard(card: string, text: string, raw: string, line: number, modelsDir: string): string {
  if (card === ".control" || card === ".endc")
    throw new SpiceError("ngspice control blocks (.control/.endc) are not allowed in a block circuit", line);
  if (ANALYSIS_CARDS.has(card))
    throw new SpiceError(`analysis card ${card} is not allowed in the circuit: the check script asks for the analysis (tran, ac, op)`, line);
  if (OUTPUT_CARDS.has(card)) throw new SpiceError(`${card} is not allowed: the runner decides what ngspice writes`, line);
  if (card === ".lib") throw new SpiceError(".lib is not allowed; use .include NAME.lib with a file of the shared model library", line);
  if (card === ".end") throw new SpiceError(".end is not allowed: the runner ends the deck", line);
  if (!ALLOWED_CARDS.has(card)) throw new SpiceError(`${card} is not allowed; a block circuit holds ${ALLOWED_TEXT}`, line);
  if (card === ".options" || card === ".option" || card === ".opt") checkOptions(text.slice(card.length), line);
  if (card === ".include" || card === ".inc") return includeLine(text.slice(card.length).trim(), line, modelsDir);
  return raw;
}

function checkOptions(rest: string, line: number) {
  for (const item of rest.replace(/\s*=\s*/g, "=").split(/\s+/).filter(Boolean)) {
    const name = item.split("=")[0].toLowerCase();
    if (!ALLOWED_OPTIONS.has(name))
      throw new SpiceError(`option "${name}" is not allowed; numerical options only (${[...ALLOWED_OPTIONS].join(", ")})`, line);
  }
}

function includeLine(arg: string, line: number, modelsDir: string): string {
  const name = arg.replace(/^["']|["']$/g, "");
  if (!LIB_FILE.test(name))
    throw new SpiceError(`.include ${arg} is not allowed: only NAME.lib from the shared model library may be included`, line);
  const file = path.join(modelsDir, name);
  if (!fs.existsSync(file)) {
    const known = fs.existsSync(modelsDir) ? fs.readdirSync(modelsDir).filter((f) => f.endsWith(".lib")) : [];
    throw new SpiceError(`.include ${name}: no such file in the model library (${known.join(", ") || "empty"})`, line);
  }
  return `.include "${file}"`;
}
