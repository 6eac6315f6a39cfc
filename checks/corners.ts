import { readTolerance, type Tolerance } from "./block/params";
import type { ParamSpec } from "./block/types";
import { formatNumber, formatQuantity } from "./units";

/** A point in tolerance space; `label` names only the parameters moved off nominal. */
export type Corner = { label: Record<string, string>; values: Record<string, number> };
export type Toleranced = { p: ParamSpec; t: Tolerance };

export const EXHAUSTIVE_LIMIT = 10;
const MONTE_CARLO_SAMPLES = 500;

// mulberry32: a small seeded generator, so a Monte Carlo run gives the same report every time.
export function seeded(seed: number) {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

export function seedOf(text: string): number {
  let h = 2166136261;
  for (let i = 0; i < text.length; i++) h = Math.imul(h ^ text.charCodeAt(i), 16777619);
  return h >>> 0;
}

export const toleranced = (params: ParamSpec[]): Toleranced[] =>
  params.filter((p) => p.tol).map((p) => ({ p, t: readTolerance(p.tol!, p.unit) }));

/** Each parameter moved by s tolerances (s = ±1 a corner, 0 nominal and unnamed, else a sample). */
export function cornerAt(params: ParamSpec[], tol: Toleranced[], s: number[]): Corner {
  const values = Object.fromEntries(params.map((p) => [p.name, p.si]));
  const label: Record<string, string> = {};
  tol.forEach(({ p, t }, k) => {
    if (s[k] === 0) return;
    const sign = s[k] < 0 ? "-" : "+";
    const whole = Math.abs(s[k]) === 1;
    if (t.kind === "rel") {
      values[p.name] = p.si * (1 + s[k] * t.rel);
      label[p.name] = whole ? `${sign}${p.tol!.replace(/\s+/g, "")}` : `${sign}${formatNumber(Math.abs(s[k]) * t.rel * 100, 3)}%`;
    } else {
      values[p.name] = p.si + s[k] * t.abs;
      label[p.name] = whole ? `${sign}${p.tol!.trim()}` : `${sign}${formatQuantity(Math.abs(s[k]) * t.abs, p.unit, 3)}`;
    }
  });
  return { label, values };
}

/** All 2^k sign combinations at ±tol. */
export function allCorners(params: ParamSpec[], tol: Toleranced[]): Corner[] {
  const out: Corner[] = [];
  for (let m = 0; m < 1 << tol.length; m++) out.push(cornerAt(params, tol, tol.map((_, k) => ((m >> k) & 1 ? 1 : -1))));
  return out;
}

/**
 * The corner a linear model predicts worst for a margin: each parameter goes to the end of its
 * band where the margin falls (sensitivity d[k] = margin at +tol minus margin at nominal);
 * parameters the margin does not move stay nominal and are not named.
 */
export function worstSigns(d: number[], scale: number): number[] {
  const tiny = 1e-9 * Math.max(1, Math.abs(scale));
  return d.map((x) => (!Number.isFinite(x) ? 0 : x < -tiny ? 1 : x > tiny ? -1 : 0));
}

/**
 * N seeded Monte Carlo samples: normal with the tolerance as 3σ (Box–Muller), or uniform over
 * the band for `dist: uniform`. The seed comes from the toleranced parameters and N.
 */
export function monteCarloSamples(params: ParamSpec[], tol: Toleranced[], n: number, normal = true): Corner[] {
  const rand = seeded(seedOf(`${n};${tol.map(({ p }) => `${p.name}=${p.value}±${p.tol}:${p.dist ?? ""}`).join(";")}`));
  const gauss = () => {
    const u = 1 - rand(); // (0, 1]: log stays finite
    return Math.sqrt(-2 * Math.log(u)) * Math.cos(2 * Math.PI * rand());
  };
  const out: Corner[] = [];
  for (let i = 0; i < n; i++)
    out.push(cornerAt(params, tol, tol.map(({ p }) => (normal && p.dist !== "uniform" ? gauss() / 3 : 2 * rand() - 1))));
  return out;
}

/**
 * Tolerance corners for checks that need no simulation: all 2^k for k ≤ 10; above that a seeded
 * sample of 500 uniform points, which the engine evaluates besides each check's predicted worst corner.
 */
export function toleranceCorners(params: ParamSpec[]): { corners: Corner[]; method: "none" | "corners" | "worst-case" } {
  const tol = toleranced(params);
  if (tol.length === 0) return { corners: [], method: "none" };
  if (tol.length <= EXHAUSTIVE_LIMIT) return { corners: allCorners(params, tol), method: "corners" };
  return { corners: monteCarloSamples(params, tol, MONTE_CARLO_SAMPLES, false), method: "worst-case" };
}
