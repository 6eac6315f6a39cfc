import { MeasureError, expectAnalysis, segmentAt } from "./signal";
import type { SimResult } from "../spice/types";

// ngspice's .noise writes the output noise density (V/√Hz at the output node) and the same
// referred to the input source (V/√Hz or A/√Hz), per frequency of the sweep.

function spectrum(res: SimResult, which: string, measure: string): Float64Array {
  expectAnalysis(res, "noise", measure);
  if (which !== "out" && which !== "in") throw new MeasureError(`${measure}(res, "out" | "in"): the second argument is "out" or "in", not "${which}"`);
  const v = res.vectors[`${which === "out" ? "onoise" : "inoise"}_spectrum`];
  if (!v) throw new MeasureError(`${measure}(): ngspice wrote no ${which === "out" ? "output" : "input"} noise spectrum`);
  return v;
}

/** Noise density at f, interpolated as a power law (straight on log-log axes) between sweep points. */
export function noise_density(res: SimResult, which: string, f: number): number {
  const d = spectrum(res, which, "noise_density");
  const s = res.scale;
  if (!(f >= s[0] * (1 - 1e-12) && f <= s[s.length - 1] * (1 + 1e-12)))
    throw new MeasureError(`noise_density(): ${f} Hz lies outside the sweep ${s[0]} Hz to ${s[s.length - 1]} Hz`);
  const k = segmentAt(s, f);
  if (!(d[k] > 0 && d[k + 1] > 0)) return d[k] + ((f - s[k]) / (s[k + 1] - s[k])) * (d[k + 1] - d[k]);
  const u = Math.log(f / s[k]) / Math.log(s[k + 1] / s[k]);
  return Math.exp(Math.log(d[k]) + u * Math.log(d[k + 1] / d[k]));
}

/**
 * RMS noise over the analysed band: √∫ d(f)² df, each segment integrated exactly as the power
 * law through its two end points (as ngspice integrates its own total).
 */
export function noise_rms(res: SimResult, which: string): number {
  const d = spectrum(res, which, "noise_rms");
  const s = res.scale;
  let sum = 0;
  for (let k = 1; k < s.length; k++) {
    const [f0, f1, p0, p1] = [s[k - 1], s[k], d[k - 1] ** 2, d[k] ** 2];
    if (!(p0 > 0 && p1 > 0) || f1 === f0) {
      sum += ((p0 + p1) / 2) * (f1 - f0);
      continue;
    }
    const a = Math.log(p1 / p0) / Math.log(f1 / f0); // p(f) = p0 (f/f0)^a
    sum += Math.abs(a + 1) < 1e-9 ? p0 * f0 * Math.log(f1 / f0) : (p0 * f0 * ((f1 / f0) ** (a + 1) - 1)) / (a + 1);
  }
  return Math.sqrt(sum);
}
