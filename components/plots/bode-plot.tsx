"use client";
import { useMemo } from "react";
import type uPlot from "uplot";
import type { Report, Waveform } from "@/checks";
import { eng } from "../eng";
import { COPPER, INKS, engAxis } from "./axes";
import { PlotLegend } from "./plot-legend";
import { UPlotChart } from "./uplot-chart";
import { verdictOn } from "./verdict-guides";
import type { Trace } from "./families";

/** The -3 dB point (and any other marked frequency) drawn as a thin copper line; its value is in the caption. */
function marksPlugin(marks: Waveform["marks"]): uPlot.Plugin {
  return {
    hooks: {
      draw: [
        (u) => {
          const { ctx, bbox } = u;
          ctx.save();
          ctx.strokeStyle = COPPER;
          ctx.lineWidth = devicePixelRatio;
          ctx.setLineDash([2 * devicePixelRatio, 3 * devicePixelRatio]);
          for (const m of marks) {
            const x = u.valToPos(m.x, "x", true);
            ctx.beginPath();
            ctx.moveTo(x, bbox.top);
            ctx.lineTo(x, bbox.top + bbox.height);
            ctx.stroke();
          }
          ctx.restore();
        },
      ],
    },
  };
}

function chart(wave: Waveform, kind: "magnitude" | "phase", guideYs: number[], traces: Trace[]): { options: Omit<uPlot.Options, "width">; data: uPlot.AlignedData } {
  const series = wave.series.filter((s) => kind === "magnitude" || s.phase);
  const unit = kind === "magnitude" ? "dB" : "deg";
  return {
    options: {
      height: kind === "magnitude" ? 220 : 160,
      plugins: [marksPlugin(wave.marks)],
      scales: {
        x: { time: false, distr: 3, range: (_u, lo, hi) => [lo, hi] },
        y: { range: (_u, lo, hi) => { const a = Math.min(lo, ...guideYs); const b = Math.max(hi, ...guideYs); const pad = (b - a || 1) * 0.06; return [a - pad, b + pad]; } },
      },
      axes: [engAxis("Hz", "frequency"), engAxis(unit, kind === "magnitude" ? "gain (dB)" : "phase (°)", {}, true)],
      series: [{ label: "f" }, ...series.map((s) => {
        const t = traces[wave.series.indexOf(s)];
        return { label: t?.name ?? s.node, stroke: t?.color ?? INKS[0], width: 1.4, dash: t?.dash, spanGaps: true };
      })],
    },
    data: [wave.x, ...series.map((s) => (kind === "magnitude" ? s.values : s.phase ?? []))] as uPlot.AlignedData,
  };
}

/** An AC sweep as magnitude and phase on a log frequency axis, with what the checks compared drawn on each. */
export function BodePlot({ wave, checks = [], fileName = "ac-sweep", traces: given, caption }: {
  wave: Waveform; checks?: Report["checks"]; fileName?: string; traces?: Trace[]; caption?: string;
}) {
  const traces = useMemo(() => given ?? wave.series.map((s, i) => ({ name: s.node, color: INKS[i % INKS.length] })), [given, wave]);
  const magVerdict = useMemo(() => verdictOn(wave, checks, "dB", "Hz"), [wave, checks]);
  const phVerdict = useMemo(() => {
    const v = verdictOn(wave, checks, "deg", "Hz");
    return { guides: v.guides.filter((g) => g.axis === "y"), measured: v.measured.filter((m) => m.y !== null) };
  }, [wave, checks]);
  const mag = useMemo(() => chart(wave, "magnitude", magVerdict.guides.filter((g) => g.axis === "y").map((g) => g.value), traces), [wave, magVerdict, traces]);
  const ph = useMemo(() => chart(wave, "phase", phVerdict.guides.map((g) => g.value), traces), [wave, phVerdict, traces]);
  const hasPhase = wave.series.some((s) => s.phase?.length);
  const readout = (kind: "magnitude" | "phase") => (i: number) =>
    `f = ${eng(wave.x[i], "Hz", 4)}: ${wave.series.map((s, k) => `${traces[k]?.name ?? s.node} ${(kind === "magnitude" ? s.values[i] : s.phase?.[i] ?? NaN).toFixed(2)} ${kind === "magnitude" ? "dB" : "°"}`).join(", ")}`;
  const headers = ["frequency (Hz)", ...wave.series.map((s, k) => `${traces[k]?.name ?? s.node} gain (dB)`), ...wave.series.filter((s) => s.phase).map((s) => `${traces[wave.series.indexOf(s)]?.name ?? s.node} phase (deg)`)];
  const csvData = useMemo(() => [wave.x, ...wave.series.map((s) => s.values), ...wave.series.filter((s) => s.phase).map((s) => s.phase!)], [wave]);
  return (
    <figure className="space-y-1 rounded border border-rule bg-panel p-2" data-testid="ac-plot">
      <UPlotChart options={mag.options} data={mag.data} label="AC sweep, magnitude" verdict={magVerdict} readout={readout("magnitude")}
        legend={<PlotLegend traces={traces} verdict={magVerdict} />} csv={{ fileName: `${fileName}.csv`, headers, columns: csvData }} />
      {hasPhase ? <UPlotChart options={ph.options} data={ph.data} label="AC sweep, phase" verdict={phVerdict} readout={readout("phase")}
        legend={<PlotLegend traces={traces} verdict={phVerdict} />} /> : null}
      <figcaption className="text-xs text-graphite">
        {caption ? `${caption} ` : ""}{wave.marks.length ? wave.marks.map((m) => `${m.label} of ${m.node} at ${eng(m.x, "Hz", 4)}`).join("; ") + "." : "No −3 dB point inside the sweep."}
      </figcaption>
    </figure>
  );
}
