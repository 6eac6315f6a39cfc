"use client";
import { useMemo } from "react";
import type uPlot from "uplot";
import type { Report } from "@/checks";
import { eng } from "../eng";
import { COPPER, engAxis } from "./axes";
import { UPlotChart } from "./uplot-chart";

type Corners = NonNullable<Report["checks"][number]["corners"]>;

/** A checked quantity at every tolerance corner (sorted), the nominal value, and its limits as dashed lines. */
export function CornerChart({ label, corners }: { label: string; corners: Corners }) {
  const { options, data } = useMemo(() => {
    const sorted = [...corners.values].sort((a, b) => a - b);
    const xs = sorted.map((_, i) => i + 1);
    const all = [...sorted, ...corners.limits, corners.nominal];
    const lo = Math.min(...all);
    const hi = Math.max(...all);
    const pad = (hi - lo || Math.abs(hi) || 1) * 0.12;
    const limits: uPlot.Plugin = {
      hooks: {
        draw: [
          (u) => {
            const { ctx, bbox } = u;
            ctx.save();
            ctx.font = `${11 * devicePixelRatio}px 'IBM Plex Mono', monospace`;
            const line = (v: number, color: string, dash: number[], text: string) => {
              const y = u.valToPos(v, "y", true);
              ctx.strokeStyle = color;
              ctx.fillStyle = color;
              ctx.setLineDash(dash);
              ctx.beginPath();
              ctx.moveTo(bbox.left, y);
              ctx.lineTo(bbox.left + bbox.width, y);
              ctx.stroke();
              // Right-aligned inside the plot, clear of the axis's own tick labels.
              ctx.textAlign = "right";
              ctx.fillText(text, bbox.left + bbox.width - 4, y - 3 * devicePixelRatio);
            };
            for (const l of corners.limits) line(l, "#a63d2f", [6, 4], `limit ${eng(l, corners.unit)}`);
            line(corners.nominal, COPPER, [2, 3], `nominal ${eng(corners.nominal, corners.unit)}`);
            ctx.restore();
          },
        ],
      },
    };
    const options: Omit<uPlot.Options, "width"> = {
      height: 200,
      plugins: [limits],
      // The caption says what the points are; a hover legend of corner numbers would only add noise.
      legend: { show: false },
      scales: { x: { time: false, range: [0, xs.length + 1] }, y: { range: [lo - pad, hi + pad] } },
      axes: [
        engAxis("", "corners, sorted", { values: (_u, s) => s.map((v) => (Number.isInteger(v) && v >= 1 && v <= xs.length ? String(v) : "")) }),
        engAxis(corners.unit, corners.quantity),
      ],
      series: [
        { label: "corner" },
        { label: corners.quantity, stroke: "#2b2b2a", width: 0, points: { show: true, size: 6, fill: "#2b2b2a" }, value: (_u, v) => (v == null ? "—" : eng(v, corners.unit)) },
      ],
    };
    return { options, data: [xs, sorted] as uPlot.AlignedData };
  }, [corners]);
  return (
    <figure className="rounded border border-rule bg-panel p-2">
      <UPlotChart options={options} data={data} label={`${corners.quantity} across the tolerance corners`} />
      <figcaption className="mt-1 text-xs text-graphite">
        {corners.quantity} at {corners.values.length} tolerance corners for “{label}”: from {eng(Math.min(...corners.values), corners.unit)} to{" "}
        {eng(Math.max(...corners.values), corners.unit)}; limits {corners.limits.map((l) => eng(l, corners.unit)).join(" and ")}.
      </figcaption>
    </figure>
  );
}
