import { MeasureError, expectAnalysis, segmentAt, vectorOf } from "./signal";
import type { SimResult } from "../spice/types";

// AC measures are in dB re 1 V (block circuits drive their AC source with amplitude 1, so this
// is the gain), interpolated linearly in log10(frequency) between sweep points.

// Half power: 20 log10(1/√2) = -3.0103 dB, the drop at which RC's fc = 1/(2πRC) holds exactly.
export const HALF_POWER_DB = 20 * Math.log10(Math.SQRT1_2);

function complexOf(res: SimResult, node: string, measure: string) {
  expectAnalysis(res, "ac", measure);
  vectorOf(res, node);
  const name = String(node).trim().toLowerCase();
  const c = res.complex?.[name] ?? res.complex?.[`v(${name})`];
  if (!c) throw new MeasureError(`${measure}(): no complex result for "${node}"`);
  return c;
}

export function gainCurve(res: SimResult, node: string, measure = "gain_db"): Float64Array {
  const { re, im } = complexOf(res, node, measure);
  return re.map((r, k) => 20 * Math.log10(Math.hypot(r, im[k])));
}

/** Phase in degrees, unwrapped along the sweep from the first point's value in (-180, 180]. */
export function phaseCurve(res: SimResult, node: string, measure = "phase"): Float64Array {
  const { re, im } = complexOf(res, node, measure);
  const out = new Float64Array(re.length);
  let turn = 0;
  for (let k = 0; k < re.length; k++) {
    const p = (Math.atan2(im[k], re[k]) * 180) / Math.PI;
    if (k > 0) {
      const jump = p + turn - out[k - 1];
      if (jump > 180) turn -= 360 * Math.round(jump / 360);
      else if (jump < -180) turn += 360 * Math.round(-jump / 360);
    }
    out[k] = p + turn;
  }
  return out;
}

export function atFrequency(res: SimResult, curve: Float64Array, f: number, measure: string): number {
  const s = res.scale;
  const lo = s[0];
  const hi = s[s.length - 1];
  if (!(f >= lo * (1 - 1e-12) && f <= hi * (1 + 1e-12)))
    throw new MeasureError(`${measure}(): ${f} Hz lies outside the sweep ${lo} Hz to ${hi} Hz`);
  if (s.length === 1) return curve[0];
  const k = segmentAt(s, f);
  const u = Math.log10(f / s[k]) / Math.log10(s[k + 1] / s[k]);
  return curve[k] + u * (curve[k + 1] - curve[k]);
}

export function gain_db(res: SimResult, node: string, f: number): number {
  return atFrequency(res, gainCurve(res, node), f, "gain_db");
}

export function phase(res: SimResult, node: string, f: number): number {
  return atFrequency(res, phaseCurve(res, node), f, "phase");
}

export type F3dbEdge = "lower" | "upper";

/** Where the gain, scanned from index `from` one step at a time (`dir` ±1), first reaches `level`; log-f interpolated. */
function crossing(s: Float64Array, g: Float64Array, from: number, dir: 1 | -1, level: number): number | null {
  for (let k = from + dir; k >= 0 && k < g.length; k += dir)
    if (g[k] <= level) {
      const j = k - dir;
      const u = (level - g[j]) / (g[k] - g[j]);
      return 10 ** (Math.log10(s[j]) + u * Math.log10(s[k] / s[j]));
    }
  return null;
}

/**
 * The -3.01 dB frequency. Without `edge` the response's shape picks the reference:
 * - it does not rise (low-pass, or a notch whose low end is the higher): reference the gain at the
 *   lowest swept frequency, scan upward (the original low-pass reading, unchanged);
 * - it rises (high-pass, or a notch whose high end is the higher): reference the gain at the
 *   highest swept frequency, scan downward;
 * - it peaks more than 3 dB above both ends (band-pass): refused, because there are two edges.
 * With `edge` ("lower" / "upper") the reference is the sweep's maximum and the scan runs from
 * there downward / upward: a band-pass's two edges (also a peaking low-pass's corner measured from its peak).
 */
export function f3db(res: SimResult, node: string, edge?: F3dbEdge): number {
  const g = gainCurve(res, node, "f3db");
  const s = res.scale;
  const n = g.length;
  if (edge !== undefined) {
    if (edge !== "lower" && edge !== "upper") throw new MeasureError(`f3db(res, node, edge): edge is "lower" or "upper", not "${edge}"`);
    let top = 0;
    for (let k = 1; k < n; k++) if (g[k] > g[top]) top = k;
    const f = crossing(s, g, top, edge === "lower" ? -1 : 1, g[top] + HALF_POWER_DB);
    if (f !== null) return f;
    throw new MeasureError(`f3db(): the gain of "${node}" does not fall 3 dB below its maximum (${g[top].toFixed(2)} dB at ${s[top]} Hz) ${edge === "lower" ? `down to ${s[0]} Hz` : `up to ${s[n - 1]} Hz`}`);
  }
  let max = -Infinity;
  for (let k = 0; k < n; k++) max = Math.max(max, g[k]);
  if (max + HALF_POWER_DB > Math.max(g[0], g[n - 1]))
    throw new MeasureError(`f3db(): the gain of "${node}" peaks more than 3 dB above both ends of the sweep (a band-pass): ask for an edge, f3db(res, "${node}", "lower") or "upper"`);
  if (g[n - 1] > g[0]) {
    const f = crossing(s, g, n - 1, -1, g[n - 1] + HALF_POWER_DB);
    if (f !== null) return f;
    throw new MeasureError(`f3db(): the gain of "${node}" does not fall 3 dB below its high-frequency value within the sweep (down to ${s[0]} Hz)`);
  }
  const f = crossing(s, g, 0, 1, g[0] + HALF_POWER_DB);
  if (f !== null) return f;
  throw new MeasureError(`f3db(): the gain of "${node}" does not fall 3 dB below its low-frequency value within the sweep (to ${s[n - 1]} Hz)`);
}
