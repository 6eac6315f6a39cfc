// Numbers as an engineer writes them: three significant figures with an SI prefix and the unit (`2.26 kHz`, `4.7 nF`).
const PREFIXES: [number, string][] = [
  [1e12, "T"], [1e9, "G"], [1e6, "M"], [1e3, "k"], [1, ""], [1e-3, "m"], [1e-6, "µ"], [1e-9, "n"], [1e-12, "p"], [1e-15, "f"],
];

// Units where a prefix would read wrong (dB, degrees, plain ratios) keep the plain number.
const NO_PREFIX = new Set(["dB", "deg", "%", ""]);

/** keepZeros keeps trailing zeros, so `2.5750 V` shows it was read to five digits. */
export function eng(value: number, unit = "", digits = 3, keepZeros = false): string {
  if (!Number.isFinite(value)) return `${value}${unit ? ` ${unit}` : ""}`;
  const u = unit === "ohm" ? "Ω" : unit;
  if (value === 0) return `0${u ? ` ${u}` : ""}`;
  const tidy = keepZeros ? (x: string) => x : trim;
  if (NO_PREFIX.has(unit)) return `${tidy(value.toPrecision(digits))}${u ? ` ${u}` : ""}`;
  const abs = Math.abs(value);
  const [scale, prefix] = PREFIXES.find(([s]) => abs >= s * 0.9995) ?? PREFIXES[PREFIXES.length - 1];
  return `${tidy((value / scale).toPrecision(digits))} ${prefix}${u}`.trim();
}

const trim = (s: string) => (s.includes("e") ? s : s.includes(".") ? s.replace(/0+$/, "").replace(/\.$/, "") : s);

/**
 * The engine writes values so mathjs can read them back (`98.73 kohm`, `4.7 uF`); on screen they are typeset
 * (`98.73 kΩ`, `4.7 µF`). Only a unit right after a number changes, so expressions and names stay as written.
 */
export function typesetUnits(text: string): string {
  return text
    .replace(/(\d\s?)([TGMkmunpf]?)ohms?\b/g, (_m, n: string, p: string) => `${n}${p === "u" ? "µ" : p}Ω`)
    .replace(/(\d\s?)u(?=(?:F|H|s|V|A|W|S|Hz)\b)/g, "$1µ");
}

/** Split a written value at its decimal point so a table can align a column of them. */
export function splitDecimal(text: string): { int: string; frac: string } {
  const m = /^([-+−]?\d+)(.*)$/.exec(text.trim());
  return m ? { int: m[1], frac: m[2] } : { int: "", frac: text.trim() };
}

/** `2026-12-02T01:40:00Z` → `2 Dec 2026, 01:40` (UTC, so server and browser agree). */
export function when(iso: string | null | undefined): string {
  if (!iso) return "—";
  const d = new Date(iso);
  return `${d.toLocaleDateString("en-GB", { day: "numeric", month: "short", year: "numeric", timeZone: "UTC" })}, ${d.toISOString().slice(11, 16)}`;
}

export function duration(ms: number | null | undefined): string {
  if (ms == null) return "—";
  return ms < 1000 ? `${Math.round(ms)} ms` : `${(ms / 1000).toFixed(ms < 10_000 ? 2 : 1)} s`;
}
