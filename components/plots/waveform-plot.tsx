"use client";
import { useMemo } from "react";
import type uPlot from "uplot";
import type { Report, Waveform } from "@/checks";
import { eng } from "../eng";
import { COPPER_PALE, INKS, engAxis } from "./axes";
import { PlotLegend } from "./plot-legend";
import { UPlotChart } from "./uplot-chart";
import { verdictOn } from "./verdict-guides";

/** A transient: node voltages against time, the measured windows shaded, each check's guides and measured value drawn. */
export function WaveformPlot({ wave, checks = [], fileName = "transient" }: { wave: Waveform; checks?: Report["checks"]; fileName?: string }) {
  const verdict = useMemo(() => verdictOn(wave, checks, "V", "s"), [wave, checks]);
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
        x: { time: false },
        y: { range: (_u, lo, hi) => { const a = Math.min(lo, ...guideYs); const b = Math.max(hi, ...guideYs); const pad = (b - a || 1) * 0.06; return [a - pad, b + pad]; } },
      },
      axes: [engAxis("s", "time"), engAxis("V", "voltage", {}, true)],
      series: [{ label: "t" }, ...wave.series.map((s, i) => ({ label: s.node, stroke: INKS[i % INKS.length], width: 1.4 }))],
    };
    return { options, data: [wave.x, ...wave.series.map((s) => s.values)] as uPlot.AlignedData };
  }, [wave, verdict]);
  const readout = (i: number) => `t = ${eng(wave.x[i], "s", 4)}: ${wave.series.map((s) => `${s.node} ${eng(s.values[i], "V", 4)}`).join(", ")}`;
  const windows = wave.windows.map((w) => `${w.measure} of ${w.node} from ${eng(w.from, "s")} to ${eng(w.to, "s")}${w.value !== undefined ? ` = ${eng(w.value, w.measure === "freq" ? "Hz" : w.measure === "thd" ? "" : "V", 4)}` : ""}`);
  return (
    <figure className="rounded border border-rule bg-panel p-2" data-testid="transient-plot">
      <UPlotChart options={options} data={data} label={`Transient of ${wave.series.map((s) => s.node).join(", ")}`} verdict={verdict} readout={readout}
        legend={<PlotLegend traces={wave.series.map((s, i) => ({ name: s.node, color: INKS[i % INKS.length] }))} verdict={verdict} windows={wave.windows.length > 0} />}
        csv={{ fileName: `${fileName}.csv`, headers: ["time (s)", ...wave.series.map((s) => `${s.node} (V)`)] }} />
      {windows.length ? <figcaption className="mt-1 text-xs text-graphite">Measured: {[...new Set(windows)].join("; ")}.</figcaption> : null}
    </figure>
  );
}
