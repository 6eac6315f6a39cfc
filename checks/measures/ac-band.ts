import { atFrequency, gainCurve, phaseCurve } from "./ac";
import { MeasureError, NothingToMeasure } from "./signal";
import type { SimResult } from "../spice/types";

// AC measures over a band, computed from the sweep: the extreme sample's neighbourhood is
// refined with the parabola through three points against log10 f, so a peak between two
// sweep points is found rather than the nearest sample.

type Extreme = { f: number; db: number };

/** The vertex of the parabola through three points, when it lies between the outer two. */
function vertex(x: number[], y: number[]): { x: number; y: number } | null {
  const [x0, x1, x2] = x;
  const [y0, y1, y2] = y;
  const d = (x0 - x1) * (x0 - x2) * (x1 - x2);
  const a = (x2 * (y1 - y0) + x1 * (y0 - y2) + x0 * (y2 - y1)) / d;
  const b = (x2 * x2 * (y0 - y1) + x1 * x1 * (y2 - y0) + x0 * x0 * (y1 - y2)) / d;
  if (!(a !== 0 && Number.isFinite(a))) return null;
  const xv = -b / (2 * a);
  if (!(xv > x0 && xv < x2)) return null;
  const c = y0 - a * x0 * x0 - b * x0;
  return { x: xv, y: a * xv * xv + b * xv + c };
}

/** Largest (sign 1) or smallest (sign -1) gain of `node` over [f1, f2]. */
function extreme(res: SimResult, node: string, f1: number, f2: number, sign: 1 | -1, measure: string): Extreme {
  const g = gainCurve(res, node, measure);
  const s = res.scale;
  if (!(f1 < f2)) throw new MeasureError(`${measure}(): the band needs f1 < f2 (got ${f1} Hz to ${f2} Hz)`);
  // The band's own end points, then every sweep point strictly inside it.
  const fs = [f1];
  const gs = [atFrequency(res, g, f1, measure)];
  for (let k = 0; k < s.length; k++) if (s[k] > f1 && s[k] < f2) fs.push(s[k]), gs.push(g[k]);
  fs.push(f2);
  gs.push(atFrequency(res, g, f2, measure));
  let best = 0;
  for (let k = 1; k < gs.length; k++) if (sign * gs[k] > sign * gs[best]) best = k;
  let out: Extreme = { f: fs[best], db: gs[best] };
  if (best > 0 && best < gs.length - 1) {
    // Fit the power ratio's reciprocal (1/|H|² at a maximum, |H|² at a minimum): near a resonance
    // it is a parabola in log f, where the dB curve is not.
    const p = (db: number) => 10 ** ((-sign * db) / 10);
    const v = vertex([best - 1, best, best + 1].map((k) => Math.log10(fs[k])), [best - 1, best, best + 1].map((k) => p(gs[k])));
    const db = v && v.y > 0 ? -sign * 10 * Math.log10(v.y) : NaN;
    if (v && sign * db >= sign * out.db) out = { f: 10 ** v.x, db };
  }
  return out;
}

const whole = (res: SimResult) => [res.scale[0], res.scale[res.scale.length - 1]] as const;

export const peak_freq = (res: SimResult, node: string) => extreme(res, node, ...whole(res), 1, "peak_freq").f;
export const peak_gain_db = (res: SimResult, node: string) => extreme(res, node, ...whole(res), 1, "peak_gain_db").db;
export const max_gain_db = (res: SimResult, node: string, f1: number, f2: number) => extreme(res, node, f1, f2, 1, "max_gain_db").db;
export const min_gain_db = (res: SimResult, node: string, f1: number, f2: number) => extreme(res, node, f1, f2, -1, "min_gain_db").db;

/** The first frequency, scanning upward, where the gain crosses `level` dB; log-f interpolated. */
export function cross_freq(res: SimResult, node: string, level: number, measure = "cross_freq"): number {
  const g = gainCurve(res, node, measure);
  const s = res.scale;
  for (let k = 1; k < g.length; k++) {
    const [a, b] = [g[k - 1] - level, g[k] - level];
    if (a === 0) return s[k - 1];
    if (a * b < 0 || b === 0) return 10 ** (Math.log10(s[k - 1]) + (a / (a - b)) * Math.log10(s[k] / s[k - 1]));
  }
  let [lo, hi] = [Infinity, -Infinity];
  for (const x of g) [lo, hi] = [Math.min(lo, x), Math.max(hi, x)];
  throw new NothingToMeasure(`the gain of "${node}" never crosses ${level} dB within the sweep (it spans ${lo.toFixed(2)} dB to ${hi.toFixed(2)} dB)`);
}

/**
 * 180° plus the phase of a loop-gain node where its gain first crosses 0 dB. The phase is
 * unwrapped along the sweep from its value at the lowest frequency, taken in (-180°, 180°].
 */
export function phase_margin(res: SimResult, node: string): number {
  const fc = cross_freq(res, node, 0, "phase_margin");
  return 180 + atFrequency(res, phaseCurve(res, node, "phase_margin"), fc, "phase_margin");
}
