import { sanitizeNetlist, type Includes } from "./sanitize";
import { SpiceError, type Analysis, type SimRequest } from "./types";
import { dcCard, noiseCard, tfCard } from "./cards";
import { defaultModelsDir } from "./paths";

// Refused before ngspice runs: a run this large is a mistake or an attack, not a check.
export const MAX_TRAN_POINTS = 2e6;
export const MAX_AC_POINTS = 1e5;

const IDENT = /^[A-Za-z_][A-Za-z0-9_]*$/;

/** The analysis card for a request, after checking its numbers and the points cap. */
export function analysisLine(a: Analysis): string {
  if (a.kind === "op") return ".op";
  if (a.kind === "dc") return dcCard(a);
  if (a.kind === "noise") return noiseCard(a);
  if (a.kind === "tf") return tfCard(a);
  if (a.kind === "tran") {
    if (!(a.stop > 0 && a.step > 0 && Number.isFinite(a.stop / a.step)))
      throw new SpiceError(`tran: stop and step must be positive times (got stop=${a.stop} s, step=${a.step} s)`);
    const points = a.stop / a.step;
    if (points > MAX_TRAN_POINTS)
      throw new SpiceError(`tran: stop/step asks for ${fmt(points)} points, more than the cap of ${fmt(MAX_TRAN_POINTS)}`);
    return `.tran ${num(a.step)} ${num(a.stop)}${a.uic ? " uic" : ""}`;
  }
  if (!(a.f1 > 0 && a.f2 > a.f1 && Number.isFinite(a.f2)))
    throw new SpiceError(`ac: need 0 < f1 < f2 (got f1=${a.f1} Hz, f2=${a.f2} Hz)`);
  if (!(Number.isInteger(a.perDecade) && a.perDecade >= 1))
    throw new SpiceError(`ac: points per decade must be a whole number ≥ 1 (got ${a.perDecade})`);
  const points = Math.log10(a.f2 / a.f1) * a.perDecade + 1;
  if (points > MAX_AC_POINTS)
    throw new SpiceError(`ac: the sweep asks for ${fmt(points)} points, more than the cap of ${fmt(MAX_AC_POINTS)}`);
  return `.ac dec ${a.perDecade} ${num(a.f1)} ${num(a.f2)}`;
}

/** Number of deck lines before the circuit's first line: the title and one .param line each. */
export function circuitOffset(req: SimRequest): number {
  return 1 + Object.keys(req.params).length;
}

/** DESIGN.md deck: title line, .param lines in SI numbers, the circuit, the analysis line, .end. */
export function writeDeck(req: SimRequest, where: string | Includes = defaultModelsDir()): string {
  const title = req.title.replace(/[\r\n]+/g, " ").trim() || "untitled block";
  const params = Object.entries(req.params).map(([name, value]) => {
    if (!IDENT.test(name)) throw new SpiceError(`parameter name "${name}" is not an identifier`);
    if (!Number.isFinite(value)) throw new SpiceError(`parameter ${name} is not a finite number (${value})`);
    return `.param ${name}=${num(value)}`;
  });
  // Team model files travel in the deck, after the circuit, so the circuit keeps its line numbers.
  const includes: Includes = typeof where === "string" ? { modelsDir: where, models: req.models, appended: [] } : { ...where, models: req.models ?? where.models, appended: [] };
  const circuit = sanitizeNetlist(req.circuit, includes);
  const temp = req.analysis.temp;
  if (temp !== undefined && !(Number.isFinite(temp) && temp > -273.15)) throw new SpiceError(`temperature ${temp} °C is below absolute zero`);
  // A member of a temperature sweep: the engine's own .temp line, after the circuit's (the last one counts).
  const tempLine = temp !== undefined ? [`.temp ${num(temp)}`] : [];
  return [title, ...params, circuit, ...includes.appended!, ...tempLine, analysisLine(req.analysis), ".end", ""].join("\n");
}

// Shortest round-trip form; ngspice reads "2.2e-08" and "1e+21" as plain numbers.
const num = (x: number) => String(x);
const fmt = (x: number) => (x >= 1e4 ? x.toExponential(2) : String(Math.round(x)));
