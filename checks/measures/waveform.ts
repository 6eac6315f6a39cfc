import { f3db, gainCurve, phaseCurve } from "./ac";
import { MeasureError, vectorOf } from "./signal";
import { sweepWaveform } from "./sweep-plot";
import type { SimResult } from "../spice/types";

export const MAX_PLOT_POINTS = 2000;
// checks/script/builtins.ts marks a measured corner with the same label, so it is drawn once.
const F3DB_LABEL = "−3 dB";

/** The -3 dB points to mark: the one f3db() reads, or a band-pass's two edges; none if the sweep holds none. */
function cornerMarks(res: SimResult, node: string): { node: string; x: number; label: string }[] {
  let bandPass = false;
  const tryAt = (edge?: "lower" | "upper") => {
    try {
      return [{ node, x: f3db(res, node, edge), label: F3DB_LABEL }];
    } catch (e) {
      bandPass ||= /band-pass/.test((e as Error).message);
      return []; // no -3 dB point inside this sweep: nothing to mark
    }
  };
  const one = tryAt();
  return bandPass ? [...tryAt("lower"), ...tryAt("upper")] : one;
}

export type PlotWindow = { node: string; from: number; to: number; measure: string; value?: number };
export type Waveform = {
  analysis: "tran" | "ac" | "dc" | "noise";
  x: number[];
  /** dc and noise plots: the x and y units ("degC" for a temperature sweep, "V/Hz^0.5" for noise). */
  xUnit?: string;
  yUnit?: string;
  series: { node: string; values: number[]; phase?: number[] }[];
  windows: PlotWindow[];
  marks: { node: string; x: number; label: string; value?: number }[];
};

/**
 * Sample indices to plot, at most MAX_PLOT_POINTS: each of 1000 buckets keeps the minimum and
 * maximum of the first series, so peaks survive (a uniform pick would shave them) and all
 * series share one x axis of real simulation points.
 */
function plotIndices(n: number, guide: Float64Array): number[] {
  if (n <= MAX_PLOT_POINTS) return Array.from({ length: n }, (_, k) => k);
  const buckets = MAX_PLOT_POINTS / 2 - 1;
  const keep = new Set<number>([0, n - 1]);
  for (let b = 0; b < buckets; b++) {
    const lo = 1 + Math.floor(((n - 2) * b) / buckets);
    const hi = 1 + Math.floor(((n - 2) * (b + 1)) / buckets);
    let min = lo;
    let max = lo;
    for (let k = lo; k < hi; k++) {
      if (guide[k] < guide[min]) min = k;
      if (guide[k] > guide[max]) max = k;
    }
    keep.add(min).add(max);
  }
  return [...keep].sort((a, b) => a - b);
}

const pick = (v: Float64Array, idx: number[]) => idx.map((k) => v[k]);

/** The plot data for a simulation: tran in volts over time; ac in dB and degrees, with the -3 dB point marked. */
export function waveformFor(res: SimResult, nodes: string[], windows: PlotWindow[] = []): Waveform {
  if (res.analysis === "op" || res.analysis === "tf") throw new MeasureError(`a ${res.analysis} result has no waveform to plot`);
  if (nodes.length === 0) throw new MeasureError("waveformFor() needs at least one node");
  if (res.analysis === "dc" || res.analysis === "noise") return sweepWaveform(res, nodes, windows);
  if (res.analysis === "tran") {
    const curves = nodes.map((n) => vectorOf(res, n));
    const idx = plotIndices(res.scale.length, curves[0]);
    return {
      analysis: "tran",
      x: pick(res.scale, idx),
      series: nodes.map((node, k) => ({ node, values: pick(curves[k], idx) })),
      windows,
      marks: [],
    };
  }
  const gains = nodes.map((n) => gainCurve(res, n, "waveform"));
  const idx = plotIndices(res.scale.length, gains[0]);
  const marks = nodes.flatMap((node) => cornerMarks(res, node));
  return {
    analysis: "ac",
    x: pick(res.scale, idx),
    series: nodes.map((node, k) => ({ node, values: pick(gains[k], idx), phase: pick(phaseCurve(res, node, "waveform"), idx) })),
    windows,
    marks,
  };
}
