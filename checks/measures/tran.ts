import { MeasureError, NothingToMeasure, expectAnalysis, interpolate, maxOf, minOf, vectorOf, windowOf, type Window } from "./signal";
import type { SimResult } from "../spice/types";

export function peak(res: SimResult, node: string, from?: number, to?: number): number {
  return maxOf(windowOf(res, node, from, to, "peak").v);
}

export function trough(res: SimResult, node: string, from?: number, to?: number): number {
  return minOf(windowOf(res, node, from, to, "trough").v);
}

export function pp(res: SimResult, node: string, from?: number, to?: number): number {
  const { v } = windowOf(res, node, from, to, "pp");
  return maxOf(v) - minOf(v);
}

/** Time average by the trapezoid rule: ngspice's time steps are not uniform. */
export function avg(res: SimResult, node: string, from?: number, to?: number): number {
  return mean(windowOf(res, node, from, to, "avg"));
}

export function rms(res: SimResult, node: string, from?: number, to?: number): number {
  const { t, v, from: a, to: b } = windowOf(res, node, from, to, "rms");
  let sum = 0;
  // Exact integral of the square of the linear segment between two samples.
  for (let k = 1; k < t.length; k++) sum += ((t[k] - t[k - 1]) * (v[k - 1] ** 2 + v[k - 1] * v[k] + v[k] ** 2)) / 3;
  return Math.sqrt(sum / (b - a));
}

export function mean({ t, v, from, to }: Window): number {
  let sum = 0;
  for (let k = 1; k < t.length; k++) sum += ((t[k] - t[k - 1]) * (v[k - 1] + v[k])) / 2;
  return sum / (to - from);
}

/**
 * Times where the signal rises through `level`, linearly interpolated. A crossing counts only
 * after the signal has been below level - hysteresis, so ripple near the level is not a cycle.
 */
export function risingCrossings({ t, v }: Window, level: number, hysteresis: number): number[] {
  const out: number[] = [];
  let armed = false;
  for (let k = 1; k < t.length; k++) {
    if (v[k - 1] < level - hysteresis) armed = true;
    if (armed && v[k - 1] < level && v[k] >= level) {
      out.push(t[k - 1] + ((level - v[k - 1]) / (v[k] - v[k - 1])) * (t[k] - t[k - 1]));
      armed = false;
    }
  }
  return out;
}

// A window whose swing is this far below the largest value of the whole run holds only the
// solver's rounding (double precision carries about 16 digits; its residue after thousands of
// steps sits some 12 decades down): engineering judgement, not a standard.
export const NUMERICAL_FLOOR = 1e-12;
// A cycle drawn by fewer time steps than this is the solver alternating step to step, not a
// waveform: a sine needs several points a period to be told from its alias (common practice).
export const MIN_STEPS_PER_CYCLE = 8;

/** Mean frequency: whole cycles between the first and last rising crossing of the window's mean. */
export function freq(res: SimResult, node: string, from?: number, to?: number): number {
  const w = windowOf(res, node, from, to, "freq");
  const swing = maxOf(w.v) - minOf(w.v);
  const where = `between ${w.from} s and ${w.to} s`;
  const all = vectorOf(res, node);
  const largest = Math.max(Math.abs(maxOf(all)), Math.abs(minOf(all)));
  if (swing === 0 || swing < NUMERICAL_FLOOR * largest)
    throw new NothingToMeasure(`"${node}" does not oscillate ${where}: its swing of ${+swing.toPrecision(3)} V is numerical noise (the run reaches ${+largest.toPrecision(3)} V)`);
  const xs = risingCrossings(w, mean(w), swing * 0.05);
  if (xs.length < 2) throw new NothingToMeasure(`"${node}" does not complete a cycle ${where}`);
  const steps = (w.t.filter((x) => x >= xs[0] && x <= xs[xs.length - 1]).length - 1) / (xs.length - 1);
  if (steps < MIN_STEPS_PER_CYCLE)
    throw new NothingToMeasure(`"${node}" does not oscillate ${where}: it alternates every ${steps.toFixed(1)} time steps, which is the solver, not a waveform`);
  return (xs.length - 1) / (xs[xs.length - 1] - xs[0]);
}

export function at(res: SimResult, node: string, t: number): number {
  expectAnalysis(res, "tran", "at");
  const s = res.scale;
  if (!(t >= Math.min(s[0], 0) && t <= s[s.length - 1]))
    throw new MeasureError(`at(): ${t} s lies outside the simulated ${s[0]} s to ${s[s.length - 1]} s`);
  return interpolate(s, vectorOf(res, node), t);
}

/** First time |v| reaches `level`, interpolated; a level never reached is nothing to measure (never a time a check could pass on). */
export function startup(res: SimResult, node: string, level: number): number {
  expectAnalysis(res, "tran", "startup");
  const t = res.scale;
  const v = vectorOf(res, node);
  const L = Math.abs(level);
  if (Math.abs(v[0]) >= L) return t[0];
  for (let k = 1; k < t.length; k++) {
    const a = Math.abs(v[k - 1]);
    const b = Math.abs(v[k]);
    if (b >= L) return a === b ? t[k] : t[k - 1] + ((L - a) / (b - a)) * (t[k] - t[k - 1]);
  }
  const largest = Math.max(Math.abs(maxOf(v)), Math.abs(minOf(v)));
  throw new NothingToMeasure(`"${node}" never reaches ${+L.toPrecision(4)} V within ${t[t.length - 1]} s (largest |v| ${+largest.toPrecision(4)} V)`);
}
