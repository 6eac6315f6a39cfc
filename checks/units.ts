import type { Unit } from "mathjs";
import { isUnit, math } from "./script/math";

// The unit names reports use (DESIGN.md "Reports and badges"), in the order a match is tried.
const NAMED = ["s", "Hz", "V", "A", "ohm", "S", "F", "H", "W", "K", "dB", "deg"] as const;
// Noise densities and spectra: V/√Hz is written V/Hz^0.5 (mathjs reads it back).
const SPECTRAL = ["V/Hz^0.5", "A/Hz^0.5", "V^2/Hz", "A^2/Hz"];
const COMPOUND_PARTS = ["V", "A", "s", "ohm", "S", "F", "H", "W", "K", "dB", "deg"];
const PREFIXED = new Set(["s", "Hz", "V", "A", "ohm", "S", "F", "H", "W"]);
const PREFIXES: [number, string][] = [
  [12, "T"], [9, "G"], [6, "M"], [3, "k"], [0, ""], [-3, "m"], [-6, "u"], [-9, "n"], [-12, "p"], [-15, "f"],
];

const dims = new Map<string, number[]>();
function dimsOf(unit: string): number[] {
  let d = dims.get(unit);
  if (!d) dims.set(unit, (d = math.unit(`1 ${unit}`).dimensions));
  return d;
}
const sameDims = (a: number[], b: number[]) => a.every((x, i) => Math.abs(x - (b[i] ?? 0)) < 1e-12);

const names = new Map<string, string>();
const templates = new Map<string, Unit>();

/** 1 of a unit, parsed once: scaling by its SI value replaces mathjs's per-call unit parsing. */
function template(unit: string): Unit {
  let t = templates.get(unit);
  if (!t) templates.set(unit, (t = math.unit(1, unit)));
  return t;
}

/** The report's name for a mathjs unit's dimension: "Hz", "V/s", "" for plain. */
export function unitName(u: Unit): string {
  const key = u.dimensions.join(",");
  let name = names.get(key);
  if (name === undefined) names.set(key, (name = nameFor(u)));
  return name;
}

function nameFor(u: Unit): string {
  const d = u.dimensions;
  if (d.every((x) => x === 0)) return "";
  for (const n of NAMED) if (sameDims(d, dimsOf(n))) return n;
  for (const n of SPECTRAL) if (sameDims(d, dimsOf(n))) return n;
  for (const a of COMPOUND_PARTS)
    for (const b of COMPOUND_PARTS)
      if (a !== b && sameDims(d, dimsOf(`${a}/${b}`))) return `${a}/${b}`;
  for (const a of COMPOUND_PARTS) if (sameDims(d, dimsOf(`${a}^2`))) return `${a}^2`;
  // Nothing we name: fall back to mathjs's SI base form, e.g. "kg m^2 / s^3".
  return u.toSI().formatUnits();
}

export type Quantity = { si: number; unit: string };

/** A mathjs value (number or Unit) as a number in its report unit. */
export function toQuantity(x: unknown): Quantity | null {
  if (typeof x === "number") return { si: x, unit: "" };
  if (isUnit(x)) {
    const unit = unitName(x);
    const value = x.value ?? 1;
    if (unit === "") return { si: value, unit: "" };
    // mathjs keeps degC/degF values without their offset: ask for kelvin outright.
    if (unit === "K") return { si: x.toNumber("K"), unit };
    return { si: value / template(unit).value!, unit };
  }
  return null;
}

/** A number in a report unit back to a mathjs value (a Unit, or a number for plain). */
export function fromQuantity(si: number, unit: string): number | Unit {
  if (unit === "") return si;
  const t = template(unit);
  const u = t.clone();
  u.value = si * t.value!;
  return u;
}

const NUMBER = /^[+-]?(\d+\.?\d*|\.\d+)(e[+-]?\d+)?$/i;

/** Read a frontmatter quantity ("3.3 kohm", "22 nF", "0.9", "50%"); throws with a clear message. */
export function readQuantity(text: string): Quantity {
  const s = String(text).trim();
  if (NUMBER.test(s)) return { si: Number(s), unit: "" };
  if (s.endsWith("%") && NUMBER.test(s.slice(0, -1).trim())) return { si: Number(s.slice(0, -1)) / 100, unit: "" };
  let u: Unit;
  try {
    u = math.unit(s);
  } catch (e) {
    throw new Error(`"${s}" is not a quantity mathjs can read (${(e as Error).message})`);
  }
  if (u.value === null || !Number.isFinite(u.value)) throw new Error(`"${s}" has no number in it`);
  const q = toQuantity(u)!;
  if (!Number.isFinite(q.si)) throw new Error(`"${s}" is not a finite quantity`);
  // 22 nF is 22 × 1e-9 = 2.2000000000000002e-8 in binary; 15 digits give the written value back.
  return { si: Number(q.si.toPrecision(15)), unit: q.unit };
}

/** A number with `sig` significant digits, trailing zeros dropped; exponent form outside 1e-4..1e6. */
export function formatNumber(x: number, sig = 4): string {
  if (!Number.isFinite(x)) return String(x);
  if (x === 0) return "0";
  const r = Number(x.toPrecision(sig));
  const a = Math.abs(r);
  if (a >= 1e6 || a < 1e-4) return r.toExponential(sig - 1).replace(/\.?0+e/, "e").replace("e+", "e");
  return String(r);
}

/** "2.192 kHz", "3.3 kohm", "-3.01 dB", "0.05": readable by mathjs again. */
export function formatQuantity(si: number, unit: string, sig = 4): string {
  if (unit === "") return formatNumber(si, sig);
  // A prefix on a squared unit would be read squared ("1 mV^2" is 1e-6 V^2): no prefix there.
  const head = unit.split("/")[0];
  if (!PREFIXED.has(head) || si === 0 || !Number.isFinite(si)) return `${formatNumber(si, sig)} ${unit}`;
  const exp = Math.floor(Math.log10(Math.abs(si)) / 3) * 3;
  let i = PREFIXES.findIndex(([e]) => e <= exp);
  if (i < 0) i = PREFIXES.length - 1;
  let m = Number((si / 10 ** PREFIXES[i][0]).toPrecision(sig));
  if (Math.abs(m) >= 1000 && i > 0) m = Number((si / 10 ** PREFIXES[--i][0]).toPrecision(sig));
  return `${formatNumber(m, sig)} ${PREFIXES[i][1]}${unit}`;
}

/** Format any mathjs value for a detail text. */
export function formatValue(x: unknown, sig = 4): string {
  const q = toQuantity(x);
  if (q) return formatQuantity(q.si, q.unit, sig);
  if (typeof x === "boolean") return x ? "true" : "false";
  if (typeof x === "string") return JSON.stringify(x);
  return math.format(x as never, { precision: sig });
}
