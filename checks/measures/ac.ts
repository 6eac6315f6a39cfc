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

function atFrequency(res: SimResult, curve: Float64Array, f: number, measure: string): number {
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

/** First frequency where the gain falls 3.01 dB below its value at the sweep's lowest frequency. */
export function f3db(res: SimResult, node: string): number {
  const g = gainCurve(res, node, "f3db");
  const s = res.scale;
  const level = g[0] + HALF_POWER_DB;
  for (let k = 1; k < g.length; k++)
    if (g[k] <= level) {
      const u = (level - g[k - 1]) / (g[k] - g[k - 1]);
      return 10 ** (Math.log10(s[k - 1]) + u * Math.log10(s[k] / s[k - 1]));
    }
  throw new MeasureError(`f3db(): the gain of "${node}" does not fall 3 dB below its low-frequency value within the sweep (to ${s[s.length - 1]} Hz)`);
}
