"use client";
import { useMemo } from "react";
import type uPlot from "uplot";
import type { Waveform } from "@/checks";
import { eng } from "../eng";
import { COPPER_PALE, INKS, engAxis } from "./axes";
import { UPlotChart } from "./uplot-chart";

/** A transient: node voltages against time, the windows the checks measured over shaded pale copper. */
export function WaveformPlot({ wave }: { wave: Waveform }) {
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
    const options: Omit<uPlot.Options, "width"> = {
      height: 240,
      plugins: [shade],
      scales: { x: { time: false } },
      axes: [engAxis("s", "time"), engAxis("V", "voltage")],
      series: [
        { label: "t", value: (_u, v) => (v == null ? "—" : eng(v, "s")) },
        ...wave.series.map((s, i) => ({ label: s.node, stroke: INKS[i % INKS.length], width: 1.4, value: (_u: uPlot, v: number | null) => (v == null ? "—" : eng(v, "V")) })),
      ],
    };
    return { options, data: [wave.x, ...wave.series.map((s) => s.values)] as uPlot.AlignedData };
  }, [wave]);
  const windows = wave.windows.map((w) => `${w.measure} of ${w.node} from ${eng(w.from, "s")} to ${eng(w.to, "s")}`).join("; ");
  return (
    <figure className="rounded border border-rule bg-panel p-2">
      <UPlotChart options={options} data={data} label={`Transient of ${wave.series.map((s) => s.node).join(", ")}`} />
      <figcaption className="mt-1 text-xs text-graphite">
        Transient. {windows ? <>Shaded: the measured window ({windows}).</> : null}
      </figcaption>
    </figure>
  );
}
