import { MeasureError, expectAnalysis, interpolate, maxOf, minOf, vectorOf, windowOf, type Window } from "./signal";
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

/** Mean frequency: whole cycles between the first and last rising crossing of the window's mean. */
export function freq(res: SimResult, node: string, from?: number, to?: number): number {
  const w = windowOf(res, node, from, to, "freq");
  const swing = maxOf(w.v) - minOf(w.v);
  const xs = risingCrossings(w, mean(w), swing * 0.05);
  if (swing === 0 || xs.length < 2)
    throw new MeasureError(`freq(): "${node}" does not complete a cycle between ${w.from} s and ${w.to} s`);
  return (xs.length - 1) / (xs[xs.length - 1] - xs[0]);
}

export function at(res: SimResult, node: string, t: number): number {
  expectAnalysis(res, "tran", "at");
  const s = res.scale;
  if (!(t >= Math.min(s[0], 0) && t <= s[s.length - 1]))
    throw new MeasureError(`at(): ${t} s lies outside the simulated ${s[0]} s to ${s[s.length - 1]} s`);
  return interpolate(s, vectorOf(res, node), t);
}

/** First time |v| reaches `level`, interpolated; Infinity when it never does (a failing check, not an error). */
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
  return Infinity;
}
