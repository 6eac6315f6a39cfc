"use client";
import { useMemo } from "react";
import type uPlot from "uplot";
import type { Waveform } from "@/checks";
import { eng } from "../eng";
import { COPPER, INKS, engAxis } from "./axes";
import { UPlotChart } from "./uplot-chart";

/** The -3 dB point (and any other mark) drawn as a copper tick with its label. */
function marksPlugin(marks: Waveform["marks"]): uPlot.Plugin {
  return {
    hooks: {
      draw: [
        (u) => {
          const { ctx, bbox } = u;
          ctx.save();
          ctx.strokeStyle = COPPER;
          ctx.fillStyle = COPPER;
          ctx.setLineDash([4, 3]);
          ctx.font = `${11 * devicePixelRatio}px Inter, sans-serif`;
          for (const m of marks) {
            const x = u.valToPos(m.x, "x", true);
            ctx.beginPath();
            ctx.moveTo(x, bbox.top);
            ctx.lineTo(x, bbox.top + bbox.height);
            ctx.stroke();
            ctx.fillText(`${m.label} ${eng(m.x, "Hz")}`, x + 4, bbox.top + 14 * devicePixelRatio);
          }
          ctx.restore();
        },
      ],
    },
  };
}

function chart(wave: Waveform, kind: "magnitude" | "phase"): { options: Omit<uPlot.Options, "width">; data: uPlot.AlignedData } {
  const series = wave.series.filter((s) => kind === "magnitude" || s.phase);
  const unit = kind === "magnitude" ? "dB" : "deg";
  return {
    options: {
      height: kind === "magnitude" ? 220 : 160,
      plugins: [marksPlugin(wave.marks)],
      scales: { x: { time: false, distr: 3 } },
      axes: [engAxis("Hz", "frequency"), engAxis(unit, kind === "magnitude" ? "gain (dB)" : "phase (°)")],
      series: [
        { label: "f", value: (_u, v) => (v == null ? "—" : eng(v, "Hz")) },
        ...series.map((s, i) => ({
          label: s.node, stroke: INKS[i % INKS.length], width: 1.4,
          value: (_u: uPlot, v: number | null) => (v == null ? "—" : `${v.toFixed(2)} ${kind === "magnitude" ? "dB" : "°"}`),
        })),
      ],
    },
    data: [wave.x, ...series.map((s) => (kind === "magnitude" ? s.values : s.phase ?? []))] as uPlot.AlignedData,
  };
}

/** An AC sweep as magnitude and phase on a log frequency axis, the -3 dB point marked. */
export function BodePlot({ wave }: { wave: Waveform }) {
  const mag = useMemo(() => chart(wave, "magnitude"), [wave]);
  const ph = useMemo(() => chart(wave, "phase"), [wave]);
  const hasPhase = wave.series.some((s) => s.phase?.length);
  return (
    <figure className="space-y-1 rounded border border-rule bg-panel p-2">
      <UPlotChart options={mag.options} data={mag.data} label="AC sweep, magnitude" />
      {hasPhase ? <UPlotChart options={ph.options} data={ph.data} label="AC sweep, phase" /> : null}
      <figcaption className="text-xs text-graphite">
        AC sweep.{" "}
        {wave.marks.length ? wave.marks.map((m) => `${m.label} of ${m.node} at ${eng(m.x, "Hz")}`).join("; ") + "." : "No −3 dB point inside the sweep."}
      </figcaption>
    </figure>
  );
}
