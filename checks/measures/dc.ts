import { NothingToMeasure, MeasureError, expectAnalysis, segmentAt, vectorOf } from "./signal";
import type { SimResult } from "../spice/types";

// Measures on a DC sweep (a source's value or the temperature, in K). The sweep may run
// downward (from > to): it is read in ascending order of the swept value.

function ascending(res: SimResult, node: string, measure: string): { xs: Float64Array; ys: Float64Array } {
  expectAnalysis(res, "dc", measure);
  const ys = vectorOf(res, node);
  const xs = res.scale;
  if (xs.length < 2 || xs[0] < xs[xs.length - 1]) return { xs, ys };
  return { xs: xs.slice().reverse(), ys: ys.slice().reverse() };
}

function inside(xs: Float64Array, x: number, measure: string) {
  const [lo, hi] = [xs[0], xs[xs.length - 1]];
  const slack = (hi - lo) * 1e-9;
  if (!(x >= lo - slack && x <= hi + slack)) throw new MeasureError(`${measure}(): ${x} lies outside the sweep ${lo} to ${hi}`);
}

/** The node's value at sweep value x, linearly interpolated. */
export function dcAt(res: SimResult, node: string, x: number): number {
  const { xs, ys } = ascending(res, node, "at");
  inside(xs, x, "at");
  const k = segmentAt(xs, x);
  const u = (x - xs[k]) / (xs[k + 1] - xs[k]);
  return ys[k] + u * (ys[k + 1] - ys[k]);
}

/** d(node)/d(sweep) at x: the derivative of the parabola through the three nearest points. */
export function slope(res: SimResult, node: string, x: number): number {
  const { xs, ys } = ascending(res, node, "slope");
  inside(xs, x, "slope");
  if (xs.length < 3) throw new MeasureError("slope(): the sweep needs at least three points");
  const k = segmentAt(xs, x);
  const j = Math.min(Math.max(k + (x - xs[k] > xs[k + 1] - x ? 1 : 0), 1), xs.length - 2);
  const [x0, x1, x2] = [xs[j - 1], xs[j], xs[j + 1]];
  const [y0, y1, y2] = [ys[j - 1], ys[j], ys[j + 1]];
  // Lagrange form of the parabola's derivative, exact for uneven spacing.
  return (
    (y0 * (2 * x - x1 - x2)) / ((x0 - x1) * (x0 - x2)) +
    (y1 * (2 * x - x0 - x2)) / ((x1 - x0) * (x1 - x2)) +
    (y2 * (2 * x - x0 - x1)) / ((x2 - x0) * (x2 - x1))
  );
}

/** The first sweep value, in the sweep's own order, where the node crosses `level`; interpolated. */
export function crossing(res: SimResult, node: string, level: number): number {
  expectAnalysis(res, "dc", "crossing");
  const ys = vectorOf(res, node);
  const xs = res.scale;
  for (let k = 1; k < ys.length; k++) {
    const [a, b] = [ys[k - 1] - level, ys[k] - level];
    if (a === 0) return xs[k - 1];
    if (a * b < 0 || b === 0) return xs[k - 1] + (a / (a - b)) * (xs[k] - xs[k - 1]);
  }
  let [lo, hi] = [Infinity, -Infinity];
  for (const y of ys) [lo, hi] = [Math.min(lo, y), Math.max(hi, y)];
  throw new NothingToMeasure(`"${node}" never crosses ${level} over the sweep (it spans ${+lo.toPrecision(4)} to ${+hi.toPrecision(4)})`);
}
