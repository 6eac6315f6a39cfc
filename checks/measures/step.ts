import { MeasureError, NothingToMeasure, expectAnalysis, maxOf, minOf, vectorOf } from "./signal";
import type { SimResult } from "../spice/types";

// Step-response measures on a transient: the step runs from the node's first simulated value
// to its last (the final value), so the run must be long enough to settle. Times count from
// the start of the run.

function step(res: SimResult, node: string, measure: string) {
  expectAnalysis(res, "tran", measure);
  const v = vectorOf(res, node);
  const t = res.scale;
  const [v0, vf] = [v[0], v[v.length - 1]];
  if (!(Math.abs(vf - v0) > 1e-12 * Math.max(Math.abs(v0), Math.abs(vf), 1e-30)))
    throw new NothingToMeasure(`"${node}" ends where it starts (${+v0.toPrecision(4)} V): there is no step`);
  return { t, v, v0, vf };
}

/** The first time the node reaches `level` going from v0 toward vf, at or after index `from`. */
function reach(t: Float64Array, v: Float64Array, level: number, up: boolean, from = 1): number | null {
  for (let k = Math.max(from, 1); k < v.length; k++) {
    const [a, b] = [v[k - 1], v[k]];
    if (up ? a < level && b >= level : a > level && b <= level) return t[k - 1] + ((level - a) / (b - a)) * (t[k] - t[k - 1]);
    if (k === 1 && (up ? a >= level : a <= level)) return t[0];
  }
  return null;
}

/** Time from the first reach of lo to the first reach of hi (fractions of the step; 10 % and 90 % by default). */
export function rise_time(res: SimResult, node: string, lo = 0.1, hi = 0.9): number {
  if (!(lo >= 0 && hi <= 1 && lo < hi)) throw new MeasureError(`rise_time(): need 0 ≤ lo < hi ≤ 1 (got ${lo}, ${hi})`);
  const { t, v, v0, vf } = step(res, node, "rise_time");
  const up = vf > v0;
  const t1 = reach(t, v, v0 + lo * (vf - v0), up);
  const t2 = reach(t, v, v0 + hi * (vf - v0), up);
  if (t1 === null || t2 === null) throw new NothingToMeasure(`"${node}" does not pass ${Math.round(hi * 100)} % of its step`);
  return t2 - t1;
}

/** How far the node goes beyond its final value, as a fraction of the step (0 when it never does). */
export function overshoot(res: SimResult, node: string): number {
  const { v, v0, vf } = step(res, node, "overshoot");
  const beyond = vf > v0 ? maxOf(v) - vf : vf - minOf(v);
  return Math.max(0, beyond / Math.abs(vf - v0));
}

/** The time after which the node stays within ±band (a fraction of the step) of its final value. */
export function settling_time(res: SimResult, node: string, band: number): number {
  if (!(band > 0 && band < 1)) throw new MeasureError(`settling_time(): the band is a fraction between 0 and 1 (got ${band})`);
  const { t, v, v0, vf } = step(res, node, "settling_time");
  const tol = band * Math.abs(vf - v0);
  for (let k = v.length - 1; k > 0; k--) {
    const a = Math.abs(v[k - 1] - vf);
    if (a <= tol) continue;
    // Leaves the band between k-1 and k: interpolate where |v - vf| returns to tol.
    const edge = v[k - 1] > vf ? vf + tol : vf - tol;
    return t[k - 1] + ((edge - v[k - 1]) / (v[k] - v[k - 1])) * (t[k] - t[k - 1]);
  }
  return t[0];
}

/** The largest |dv/dt| between consecutive time points, in V/s. */
export function slew_rate(res: SimResult, node: string): number {
  expectAnalysis(res, "tran", "slew_rate");
  const v = vectorOf(res, node);
  const t = res.scale;
  let best = 0;
  for (let k = 1; k < v.length; k++) if (t[k] > t[k - 1]) best = Math.max(best, Math.abs((v[k] - v[k - 1]) / (t[k] - t[k - 1])));
  return best;
}
