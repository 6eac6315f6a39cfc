import { SpiceError, type Analysis } from "./types";

// Analysis cards for the DC sweep, noise and transfer-function analyses (ngspice manual,
// ".dc", ".noise", ".tf"). Names reach the deck only after these checks.
export const MAX_DC_POINTS = 1e5;
export const MAX_NOISE_POINTS = 1e5;
const ZERO_C_IN_K = 273.15;
const SOURCE = /^[VvIi][A-Za-z0-9_]*$/;
const NODE = /^[A-Za-z0-9_]+$/;

const num = (x: number) => String(Number(x.toPrecision(15)));

function source(name: string, what: string): string {
  if (!SOURCE.test(name)) throw new SpiceError(`${what}: "${name}" is not an independent source's name (V… or I…)`);
  return name;
}

function node(name: string, what: string): string {
  if (!NODE.test(name) || name === "0") throw new SpiceError(`${what}: "${name}" is not a node name`);
  return `v(${name})`;
}

export function dcCard(a: Extract<Analysis, { kind: "dc" }>): string {
  const temp = a.source.toLowerCase() === "temp";
  if (!temp) source(a.source, "dc");
  if (![a.from, a.to, a.step].every(Number.isFinite) || !(a.step > 0) || a.from === a.to)
    throw new SpiceError(`dc: need from ≠ to and a positive step (got ${a.from}, ${a.to}, ${a.step})`);
  const points = Math.abs(a.to - a.from) / a.step + 1;
  if (points > MAX_DC_POINTS) throw new SpiceError(`dc: the sweep asks for ${Math.round(points)} points, more than the cap of ${MAX_DC_POINTS}`);
  const [from, to] = temp ? [a.from - ZERO_C_IN_K, a.to - ZERO_C_IN_K] : [a.from, a.to];
  const step = a.to > a.from ? a.step : -a.step;
  return `.dc ${temp ? "temp" : a.source} ${num(from)} ${num(to)} ${num(step)}`;
}

export function noiseCard(a: Extract<Analysis, { kind: "noise" }>): string {
  if (!(a.f1 > 0 && a.f2 > a.f1 && Number.isFinite(a.f2))) throw new SpiceError(`noise: need 0 < f1 < f2 (got f1=${a.f1} Hz, f2=${a.f2} Hz)`);
  if (!(Number.isInteger(a.perDecade) && a.perDecade >= 1)) throw new SpiceError(`noise: points per decade must be a whole number ≥ 1 (got ${a.perDecade})`);
  const points = Math.log10(a.f2 / a.f1) * a.perDecade + 1;
  if (points > MAX_NOISE_POINTS) throw new SpiceError(`noise: the sweep asks for ${Math.round(points)} points, more than the cap of ${MAX_NOISE_POINTS}`);
  return `.noise ${node(a.node, "noise")} ${source(a.source, "noise")} dec ${a.perDecade} ${num(a.f1)} ${num(a.f2)}`;
}

export function tfCard(a: Extract<Analysis, { kind: "tf" }>): string {
  return `.tf ${node(a.node, "tf")} ${source(a.source, "tf")}`;
}

/** A DC sweep over temperature comes back in °C; the engine holds temperatures in K. */
export const sweepScale = (a: Analysis, scale: Float64Array) =>
  a.kind === "dc" && a.source.toLowerCase() === "temp" ? scale.map((c) => c + ZERO_C_IN_K) : scale;
