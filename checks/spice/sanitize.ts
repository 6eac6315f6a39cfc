import fs from "node:fs";
import path from "node:path";
import { defaultModelsDir } from "./paths";
import { tableAsPwl } from "./table-source";
import { SpiceError } from "./types";

// DESIGN.md "Block file format": what a block circuit may hold. Everything else is refused
// before ngspice runs, because ngspice can run commands, read files and write output.
const ALLOWED_CARDS = new Set([
  ".model", ".subckt", ".ends", ".param", ".func", ".ic", ".nodeset", ".temp",
  ".options", ".option", ".opt", ".global", ".include", ".inc",
]);
// A model file only defines: it sets no options, temperature or starting state for the deck it joins.
const MODEL_FILE_CARDS = new Set([".model", ".subckt", ".ends", ".param", ".func", ".global", ".include", ".inc"]);
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
// XSPICE code models that read files named in their parameters (ngspice manual, chapter "Behavioral Modeling").
const FILE_READING_MODELS = new Set(["filesource", "d_source", "d_state", "table2d", "table3d"]);
// Element letters ngspice knows without XSPICE code models or OSDI.
const ELEMENTS = "bcdefghijklmoqrstuvwxyz";
/** A model file name as `.include` and the team library use it: no directory, a SPICE library extension. */
export const MODEL_FILE = /^[A-Za-z0-9][A-Za-z0-9_.-]{0,80}\.(lib|mod|sub|cir)$/;

const ALLOWED_TEXT = "element lines, .model, .subckt/.ends, .param, .func, .ic, .nodeset, .temp, .options, .global and .include NAME.lib";
const MODEL_FILE_TEXT = ".model, .subckt/.ends with element lines inside, .param, .func, .global and .include NAME.lib";

/** Model files resolved by the caller (team first, then shared), by the name `.include` uses: text only. */
export type ModelTexts = Record<string, string>;

/**
 * Where `.include NAME` goes. A file of `models` is checked like the circuit and its include line becomes a comment;
 * when `appended` is given, its text (and that of the files it includes, each once) is pushed there for the deck to
 * carry after the circuit, so a deck is self-contained and the circuit keeps its line numbers. Any other name is
 * a file of the shared library folder, included by its absolute path.
 */
export type Includes = { modelsDir: string; models?: ModelTexts; appended?: string[] };

type Scope = { kind: "circuit" | "model"; includes: Includes; stack: string[] };

/** Strip ngspice inline comments (`;` anywhere, `$` after white space). */
function code(line: string): string {
  return line.replace(/;.*$/, "").replace(/(^|\s)\$.*$/, "").trim();
}

const includesOf = (where: string | Includes): Includes => (typeof where === "string" ? { modelsDir: where } : where);

/**
 * Check a block circuit line by line and return it with each `.include NAME.lib` resolved to an absolute
 * path. Line count is kept, so ngspice's line numbers map back.
 */
export function sanitizeNetlist(circuit: string, where: string | Includes = defaultModelsDir()): string {
  return sanitizeLines(circuit, { kind: "circuit", includes: includesOf(where), stack: [] });
}

/**
 * Check a model file as the team library stores it: definitions only, the same refusals as a circuit,
 * errors on the file's own lines. Its includes must name files of `includes`.
 */
export function sanitizeModelFile(name: string, text: string, where: string | Includes = defaultModelsDir()): string {
  return sanitizeLines(text, { kind: "model", includes: includesOf(where), stack: [name] });
}

function sanitizeLines(source: string, scope: Scope): string {
  const lines = source.replace(/\r\n?/g, "\n").split("\n");
  const what = scope.kind === "circuit" ? "a block circuit" : "a model file";
  const out: string[] = [];
  let card = ""; // the card a `+` continuation belongs to
  lines.forEach((raw, i) => {
    const line = i + 1;
    const text = code(raw);
    if (text === "" || text.startsWith("*")) return void out.push(raw);
    const first = text.split(/[\s(=]/, 1)[0].toLowerCase();
    if (first === "shell") throw new SpiceError(`\`shell\` is not allowed in ${what}`, line);
    if (text.startsWith("+")) {
      if (card === ".include" || card === ".inc") throw new SpiceError("an .include line cannot be continued", line);
      if (card === ".options" || card === ".option" || card === ".opt") checkOptions(text.slice(1), line);
      if (card === ".model") checkModelCard(text.slice(1), line, true);
      return void out.push(raw);
    }
    card = first;
    if (first.startsWith(".")) return void out.push(checkCard(first, text, raw, line, scope));
    if (first[0] === "a")
      throw new SpiceError(`XSPICE code-model instance "${first}" (A element) is not allowed: code models are not loaded, and some read files`, line);
    if ((first[0] === "e" || first[0] === "g") && /\btable\b/i.test(text)) {
      // Joined with its continuation lines, which become comments so line numbers still map back.
      let joined = text;
      for (let k = i + 1; k < lines.length && code(lines[k]).startsWith("+"); k++) {
        joined += ` ${code(lines[k]).slice(1)}`;
        lines[k] = `* (continued above) ${lines[k]}`;
      }
      card = "";
      return void out.push(tableAsPwl(joined, line));
    }
    if (!ELEMENTS.includes(first[0]))
      throw new SpiceError(`"${first}" is not a SPICE element line; ${what} holds ${scope.kind === "circuit" ? ALLOWED_TEXT : MODEL_FILE_TEXT}`, line);
    out.push(raw);
  });
  return out.join("\n");
}

function checkCard(card: string, text: string, raw: string, line: number, scope: Scope): string {
  const what = scope.kind === "circuit" ? "a block circuit" : "a model file";
  if (card === ".control" || card === ".endc")
    throw new SpiceError(`ngspice control blocks (.control/.endc) are not allowed in ${what}`, line);
  if (ANALYSIS_CARDS.has(card))
    throw new SpiceError(`analysis card ${card} is not allowed in ${scope.kind === "circuit" ? "the circuit" : "a model file"}: the check script asks for the analysis (tran, ac, op)`, line);
  if (OUTPUT_CARDS.has(card)) throw new SpiceError(`${card} is not allowed: the runner decides what ngspice writes`, line);
  if (card === ".lib") throw new SpiceError(".lib is not allowed; use .include NAME.lib with a file of the model library", line);
  if (card === ".end") throw new SpiceError(".end is not allowed: the runner ends the deck", line);
  const allowed = scope.kind === "circuit" ? ALLOWED_CARDS : MODEL_FILE_CARDS;
  if (!allowed.has(card)) throw new SpiceError(`${card} is not allowed; ${what} holds ${scope.kind === "circuit" ? ALLOWED_TEXT : MODEL_FILE_TEXT}`, line);
  if (card === ".options" || card === ".option" || card === ".opt") checkOptions(text.slice(card.length), line);
  if (card === ".model") checkModelCard(text.slice(card.length), line, false);
  if (card === ".include" || card === ".inc") return includeLine(text.slice(card.length).trim(), line, scope);
  return raw;
}

function checkOptions(rest: string, line: number) {
  for (const item of rest.replace(/\s*=\s*/g, "=").split(/\s+/).filter(Boolean)) {
    const name = item.split("=")[0].toLowerCase();
    if (!ALLOWED_OPTIONS.has(name))
      throw new SpiceError(`option "${name}" is not allowed; numerical options only (${[...ALLOWED_OPTIONS].join(", ")})`, line);
  }
}

// `.model NAME TYPE(...)`: a code-model type that reads a file is refused even though no A element could use it yet.
function checkModelCard(rest: string, line: number, continued: boolean) {
  const words = rest.trim().split(/[\s(]+/);
  const type = (continued ? "" : words[1] ?? "").toLowerCase();
  if (FILE_READING_MODELS.has(type))
    throw new SpiceError(`.model of type ${type} is not allowed: that code model reads files`, line);
  if (/\bfile\s*=/i.test(rest)) throw new SpiceError("a model parameter naming a file is not allowed", line);
}

function includeLine(arg: string, line: number, scope: Scope): string {
  const name = arg.replace(/^["']|["']$/g, "");
  if (!MODEL_FILE.test(name))
    throw new SpiceError(`.include ${arg} is not allowed: only NAME.lib from the model library may be included`, line);
  const { models, modelsDir } = scope.includes;
  if (models && Object.hasOwn(models, name)) {
    if (scope.stack.includes(name)) throw new SpiceError(`.include ${name}: the model files include each other (${[...scope.stack, name].join(" → ")})`, line);
    const header = `* ---- model file ${name}`;
    if (scope.includes.appended?.includes(header)) return `* .include ${name} (carried after the circuit)`;
    let text: string;
    try {
      text = sanitizeLines(models[name], { kind: "model", includes: scope.includes, stack: [...scope.stack, name] });
    } catch (e) {
      if (!(e instanceof SpiceError)) throw e;
      throw new SpiceError(`${name}${e.line !== undefined ? ` line ${e.line}` : ""}: ${e.message}`, line);
    }
    if (!scope.includes.appended) return `.include ${name}`;
    scope.includes.appended.push(header, text.replace(/\s+$/, ""), `* ---- end of ${name}`);
    return `* .include ${name} (carried after the circuit)`;
  }
  const file = path.join(modelsDir, name);
  if (!fs.existsSync(file)) {
    const known = fs.existsSync(modelsDir) ? fs.readdirSync(modelsDir).filter((f) => MODEL_FILE.test(f)) : [];
    throw new SpiceError(`.include ${name}: no such file in the team's or the shared model library (shared: ${known.join(", ") || "none"})`, line);
  }
  return `.include "${file}"`;
}
