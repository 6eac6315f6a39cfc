import { MeasureError, vectorOf } from "./signal";
import type { PlotWindow, Waveform } from "./waveform";
import type { SimResult } from "../spice/types";

const ZERO_C_IN_K = 273.15;

/**
 * Plot data of a DC sweep (node values against the swept value; a temperature sweep in °C,
 * as engineers read it) or a noise analysis (density against frequency, "out" and/or "in").
 * Sweeps hold at most 100,000 points, drawn whole.
 */
export function sweepWaveform(res: SimResult, nodes: string[], windows: PlotWindow[]): Waveform {
  if (res.analysis === "noise") {
    const which = nodes.filter((n) => n === "out" || n === "in");
    const series = (which.length ? which : ["out"]).map((node) => {
      const v = res.vectors[`${node === "out" ? "onoise" : "inoise"}_spectrum`];
      if (!v) throw new MeasureError(`no ${node} noise spectrum to plot`);
      return { node, values: Array.from(v) };
    });
    return { analysis: "noise", x: Array.from(res.scale), xUnit: "Hz", yUnit: "V/Hz^0.5", series, windows, marks: [] };
  }
  // dc: temperature sweeps are held in K and shown in °C.
  const temp = res.sweep?.toLowerCase() === "temp";
  const x = Array.from(res.scale, (v) => (temp ? Number((v - ZERO_C_IN_K).toPrecision(12)) : v));
  const series = nodes.map((node) => ({ node, values: Array.from(vectorOf(res, node)) }));
  return { analysis: "dc", x, xUnit: temp ? "degC" : undefined, yUnit: /^i\(/i.test(nodes[0]) ? "A" : "V", series, windows, marks: [] };
}
