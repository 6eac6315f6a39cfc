import type { SimResult } from "../spice/types";

// Measures take SI numbers (seconds, hertz, volts) and return SI numbers; the script layer
// wraps them in units. They throw MeasureError for a question the result cannot answer.
export class MeasureError extends Error {
  constructor(message: string) {
    super(message);
    this.name = "MeasureError";
  }
}

/**
 * The result holds nothing to measure (a dead oscillator's window, a level never reached): the
 * script gets NaN, so every check on it fails, and the check's detail carries this message.
 */
export class NothingToMeasure extends MeasureError {
  constructor(message: string) {
    super(message);
    this.name = "NothingToMeasure";
  }
}

export function expectAnalysis(res: SimResult, kind: SimResult["analysis"], measure: string) {
  if (res?.analysis !== kind)
    throw new MeasureError(`${measure}() needs the result of ${kind}(), not of ${res?.analysis ?? "no simulation"}()`);
}

/** A node's voltage ("out", "v(out)") or any written vector ("i(v1)"), case-insensitive. */
export function vectorOf(res: SimResult, node: string): Float64Array {
  const name = String(node).trim().toLowerCase();
  const v = res.vectors[name] ?? res.vectors[`v(${name})`];
  if (v) return v;
  const nodes = Object.keys(res.vectors).filter((n) => !/^[vi]\(/.test(n));
  throw new MeasureError(`no node "${node}" in the simulation (nodes: ${nodes.join(", ")})`);
}

/** Index of the last scale value ≤ x (scale ascending), clamped to [0, n-2]. */
export function segmentAt(scale: Float64Array, x: number): number {
  let lo = 0;
  let hi = scale.length - 1;
  while (hi - lo > 1) {
    const mid = (lo + hi) >> 1;
    if (scale[mid] <= x) lo = mid;
    else hi = mid;
  }
  return Math.min(lo, Math.max(0, scale.length - 2));
}

export function interpolate(xs: Float64Array, ys: Float64Array, x: number): number {
  if (xs.length === 1) return ys[0];
  const k = segmentAt(xs, x);
  const span = xs[k + 1] - xs[k];
  const u = span === 0 ? 0 : (x - xs[k]) / span;
  return ys[k] + u * (ys[k + 1] - ys[k]);
}

export type Window = { t: Float64Array; v: Float64Array; from: number; to: number };

/** The samples in [from, to] with interpolated end points; defaults to the whole run. */
export function windowOf(res: SimResult, node: string, from?: number, to?: number, measure = "measure"): Window {
  expectAnalysis(res, "tran", measure);
  const v = vectorOf(res, node);
  const t = res.scale;
  const start = t[0];
  const end = t[t.length - 1];
  const a = from ?? start;
  const b = to ?? end;
  const slack = (end - start) * 1e-9;
  if (!(Number.isFinite(a) && Number.isFinite(b) && a < b))
    throw new MeasureError(`${measure}(): the window needs from < to (got ${a} s to ${b} s)`);
  // With uic ngspice writes its first point one tiny step after 0: the run still covers t = 0.
  if (a < Math.min(start, 0) - slack || b > end + slack)
    throw new MeasureError(`${measure}(): the window ${a} s to ${b} s lies outside the simulated ${start} s to ${end} s`);
  const lo = Math.max(a, start);
  const hi = Math.min(b, end);
  const ts = [lo];
  const vs = [interpolate(t, v, lo)];
  for (let k = segmentAt(t, lo) + 1; k < t.length && t[k] < hi; k++) {
    if (t[k] <= lo) continue;
    ts.push(t[k]);
    vs.push(v[k]);
  }
  ts.push(hi);
  vs.push(interpolate(t, v, hi));
  return { t: Float64Array.from(ts), v: Float64Array.from(vs), from: lo, to: hi };
}

// Loops, not Math.max(...v): spreading a long run overflows the call stack.
export function maxOf(v: Float64Array): number {
  let m = -Infinity;
  for (let k = 0; k < v.length; k++) if (v[k] > m) m = v[k];
  return m;
}

export function minOf(v: Float64Array): number {
  let m = Infinity;
  for (let k = 0; k < v.length; k++) if (v[k] < m) m = v[k];
  return m;
}
