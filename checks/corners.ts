import { readTolerance } from "./block/params";
import type { ParamSpec } from "./block/types";
import { formatNumber, formatQuantity } from "./units";

export type Corner = { label: Record<string, string>; values: Record<string, number> };

const EXHAUSTIVE_LIMIT = 10;
const MONTE_CARLO_SAMPLES = 500;

// mulberry32: a small seeded generator, so a Monte Carlo run gives the same report every time.
function seeded(seed: number) {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

function seedOf(text: string): number {
  let h = 2166136261;
  for (let i = 0; i < text.length; i++) h = Math.imul(h ^ text.charCodeAt(i), 16777619);
  return h >>> 0;
}

/**
 * Tolerance corners of the toleranced parameters: all 2^k sign combinations at ±tol for
 * k ≤ 10, else a seeded Monte Carlo of 500 samples uniform inside each tolerance band.
 */
export function toleranceCorners(params: ParamSpec[]): { corners: Corner[]; method: "none" | "corners" | "monte-carlo" } {
  const tol = params.filter((p) => p.tol).map((p) => ({ p, t: readTolerance(p.tol!, p.unit) }));
  if (tol.length === 0) return { corners: [], method: "none" };
  const nominal = Object.fromEntries(params.map((p) => [p.name, p.si]));
  const at = (p: ParamSpec, t: ReturnType<typeof readTolerance>, s: number): [number, string] => {
    const sign = s < 0 ? "-" : "+";
    if (t.kind === "rel") {
      const label = Math.abs(s) === 1 ? `${sign}${p.tol!.replace(/\s+/g, "")}` : `${sign}${formatNumber(Math.abs(s) * t.rel * 100, 3)}%`;
      return [p.si * (1 + s * t.rel), label];
    }
    const label = Math.abs(s) === 1 ? `${sign}${p.tol!.trim()}` : `${sign}${formatQuantity(Math.abs(s) * t.abs, p.unit, 3)}`;
    return [p.si + s * t.abs, label];
  };
  const make = (signs: number[]): Corner => {
    const values = { ...nominal };
    const label: Record<string, string> = {};
    tol.forEach(({ p, t }, k) => ([values[p.name], label[p.name]] = at(p, t, signs[k])));
    return { label, values };
  };
  if (tol.length <= EXHAUSTIVE_LIMIT) {
    const corners: Corner[] = [];
    for (let m = 0; m < 1 << tol.length; m++) corners.push(make(tol.map((_, k) => ((m >> k) & 1 ? 1 : -1))));
    return { corners, method: "corners" };
  }
  const rand = seeded(seedOf(tol.map(({ p }) => `${p.name}=${p.value}±${p.tol}`).join(";")));
  const corners: Corner[] = [];
  for (let n = 0; n < MONTE_CARLO_SAMPLES; n++) corners.push(make(tol.map(() => 2 * rand() - 1)));
  return { corners, method: "monte-carlo" };
}
