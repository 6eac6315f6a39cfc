"use client";
import { useMemo } from "react";
import type uPlot from "uplot";
import type { Report, Waveform } from "@/checks";
import { eng } from "../eng";
import { COPPER_PALE, INKS, engAxis } from "./axes";
import { PlotLegend } from "./plot-legend";
import { UPlotChart } from "./uplot-chart";
import { verdictOn } from "./verdict-guides";
import type { Trace } from "./families";

const AXES: Record<string, { x: string; y: string; xTitle: string; yTitle: string; log?: boolean; name: string }> = {
  tran: { x: "s", y: "V", xTitle: "time", yTitle: "voltage", name: "Transient" },
  dc: { x: "V", y: "V", xTitle: "swept source", yTitle: "voltage", name: "DC sweep" },
  noise: { x: "Hz", y: "V/Hz^0.5", xTitle: "frequency", yTitle: "noise density (V/√Hz)", log: true, name: "Noise" },
};

/**
 * A transient (or DC sweep, or noise spectrum) against its x, the measured windows shaded, each check's guides and
 * measured value drawn; `traces` names each series (a worst corner, a sweep member) when the plot holds several.
 */
export function WaveformPlot({ wave, checks = [], fileName = "transient", traces: given, caption }: {
  wave: Waveform; checks?: Report["checks"]; fileName?: string; traces?: Trace[]; caption?: string;
}) {
  const base = AXES[wave.analysis] ?? AXES.tran;
  const ax = { ...base, x: wave.xUnit ?? base.x, y: wave.yUnit ?? base.y, xTitle: wave.xUnit === "degC" ? "temperature" : base.xTitle };
  const traces = useMemo(() => given ?? wave.series.map((s, i) => ({ name: s.node, color: INKS[i % INKS.length] }) as Trace), [given, wave]);
  const verdict = useMemo(() => verdictOn(wave, checks, ax.y, ax.x), [wave, checks, ax.y, ax.x]);
  const { options, data } = useMemo(() => {
    const shade: uPlot.Plugin = {
      hooks: {
        drawClear: [
          (u) => {
            const { ctx, bbox } = u;
            ctx.save();
            ctx.fillStyle = COPPER_PALE;
            // Several checks often measure over the same window: shade each span once so the tint stays pale.
            const spans = [...new Map(wave.windows.map((w) => [`${w.from}:${w.to}`, w])).values()];
            for (const w of spans) {
              const x0 = u.valToPos(w.from, "x", true);
              const x1 = u.valToPos(w.to, "x", true);
              ctx.fillRect(x0, bbox.top, Math.max(1, x1 - x0), bbox.height);
            }
            ctx.restore();
          },
        ],
      },
    };
    // The y range takes in the guides, so a limit far from the trace is still on the plot.
    const guideYs = verdict.guides.map((g) => g.value);
    const options: Omit<uPlot.Options, "width"> = {
      height: 240,
      plugins: [shade],
      scales: {
        x: { time: false, ...(ax.log ? { distr: 3 } : {}), range: (_u, lo, hi) => [lo, hi] },
        y: { ...(ax.log ? { distr: 3 } : {}), range: (_u, lo, hi) => { const a = Math.min(lo, ...guideYs); const b = Math.max(hi, ...guideYs); const pad = (b - a || 1) * 0.06; return [a - pad, b + pad]; } },
      },
      axes: [engAxis(ax.x === "degC" ? "" : ax.x, ax.x === "degC" ? "temperature (°C)" : ax.xTitle), engAxis(ax.y.includes("/") ? "" : ax.y, ax.yTitle, {}, true)],
      series: [{ label: "x" }, ...wave.series.map((s, i) => ({ label: traces[i]?.name ?? s.node, stroke: traces[i]?.color ?? INKS[i % INKS.length], width: 1.4, dash: traces[i]?.dash, spanGaps: true }))],
    };
    return { options, data: [wave.x, ...wave.series.map((s) => s.values)] as uPlot.AlignedData };
  }, [wave, verdict, traces, ax.x, ax.y, ax.log, ax.xTitle, ax.yTitle]);
  const readout = (i: number) => `${ax.xTitle} ${eng(wave.x[i], ax.x, 4)}: ${wave.series.map((s, k) => (s.values[i] == null ? "" : `${traces[k]?.name ?? s.node} ${eng(s.values[i], ax.y, 4)}`)).filter(Boolean).join(", ")}`;
  const windows = wave.windows.map((w) => `${w.measure} of ${w.node} from ${eng(w.from, "s")} to ${eng(w.to, "s")}${w.value !== undefined ? ` = ${eng(w.value, w.measure === "freq" ? "Hz" : w.measure === "thd" ? "" : "V", 4)}` : ""}`);
  return (
    <figure className="rounded border border-rule bg-panel p-2" data-testid={wave.analysis === "tran" ? "transient-plot" : `${wave.analysis}-plot`}>
      <UPlotChart options={options} data={data} label={`${ax.name} of ${wave.series.map((s) => s.node).join(", ")}`} verdict={verdict} readout={readout}
        legend={<PlotLegend traces={traces} verdict={verdict} windows={wave.windows.length > 0} />}
        csv={{ fileName: `${fileName}.csv`, headers: [`${ax.xTitle} (${ax.x})`, ...wave.series.map((s, i) => `${traces[i]?.name ?? s.node} (${ax.y})`)] }} />
      {windows.length || caption ? <figcaption className="mt-1 text-xs text-graphite">{caption} {windows.length ? `Measured: ${[...new Set(windows)].join("; ")}.` : ""}</figcaption> : null}
    </figure>
  );
}
