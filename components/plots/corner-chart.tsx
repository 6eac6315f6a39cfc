"use client";
import { useMemo } from "react";
import type uPlot from "uplot";
import type { Report } from "@/checks";
import { eng, typesetUnits } from "../eng";
import { engApart } from "../limit-margin";
import { COPPER, GUIDE_INK, VERDICT_INK, engAxis } from "./axes";
import { PlotLegend } from "./plot-legend";
import { UPlotChart, type PlotVerdict } from "./uplot-chart";

type Check = Report["checks"][number];
const NONE: string[] = [];

const nameOf = (label: Record<string, string> | undefined) =>
  label ? typesetUnits(Object.entries(label).map(([k, v]) => `${k} ${v.replace(/^-/, "−")}`).join(", ")) : "";

/** Whether a corner's value keeps every limit, read with the check's own relations. */
function keeps(v: number, limits: number[], relations: string[]): boolean {
  return limits.every((l, i) => {
    const r = relations[i];
    return r === ">" ? v > l : r === "≥" ? v >= l : r === "<" ? v < l : r === "≤" ? v <= l : true;
  });
}

/** A checked quantity at every tolerance corner (sorted), each corner named on hover and in a table, its limits dashed. */
export function CornerChart({ check }: { check: Check }) {
  const corners = check.corners!;
  const relations = check.compared?.relations ?? NONE;
  const rows = useMemo(
    () => corners.values.map((v, k) => ({ v, label: corners.labels?.[k], ok: keeps(v, corners.limits, relations) })).sort((a, b) => a.v - b.v),
    [corners, relations],
  );
  const verdict: PlotVerdict = useMemo(() => ({
    guides: [
      ...corners.limits.map((l, i) => ({ axis: "y" as const, value: l, role: "limit" as const, text: `${relations[i] ?? "limit"} ${eng(l, corners.unit, 4)}`, check: check.label, status: check.status })),
    ],
    measured: [],
  }), [corners, relations, check]);
  const { options, data } = useMemo(() => {
    const xs = rows.map((_, i) => i + 1);
    const all = [...rows.map((r) => r.v), ...corners.limits, corners.nominal];
    const lo = Math.min(...all);
    const hi = Math.max(...all);
    const pad = (hi - lo || Math.abs(hi) || 1) * 0.12;
    const nominalLine: uPlot.Plugin = {
      hooks: {
        draw: [(u) => {
          const { ctx, bbox } = u;
          const y = u.valToPos(corners.nominal, "y", true);
          ctx.save();
          ctx.strokeStyle = COPPER;
          ctx.setLineDash([2 * devicePixelRatio, 3 * devicePixelRatio]);
          ctx.beginPath();
          ctx.moveTo(bbox.left, y);
          ctx.lineTo(bbox.left + bbox.width, y);
          ctx.stroke();
          // Corners outside the limits in the failing colour, so the plot reads without the table.
          ctx.setLineDash([]);
          ctx.fillStyle = VERDICT_INK.fail;
          rows.forEach((r, i) => {
            if (r.ok || !relations.length) return;
            ctx.beginPath();
            ctx.arc(u.valToPos(i + 1, "x", true), u.valToPos(r.v, "y", true), 4.5 * devicePixelRatio, 0, 2 * Math.PI);
            ctx.fill();
          });
          ctx.restore();
        }],
      },
    };
    const options: Omit<uPlot.Options, "width"> = {
      height: 200,
      plugins: [nominalLine],
      scales: { x: { time: false, range: [0, xs.length + 1] }, y: { range: [lo - pad, hi + pad] } },
      axes: [
        engAxis("", "corners, sorted by value", { values: (_u, s) => s.map((v) => (Number.isInteger(v) && v >= 1 && v <= xs.length ? String(v) : "")) }),
        engAxis(corners.unit, corners.quantity, {}, true),
      ],
      series: [
        { label: "corner" },
        {
          label: corners.quantity, stroke: GUIDE_INK.target, width: 0,
          points: { show: true, size: 7, fill: GUIDE_INK.target },
        },
      ],
    };
    return { options, data: [xs, rows.map((r) => r.v)] as uPlot.AlignedData };
  }, [rows, corners, relations]);
  const readout = (i: number) => (rows[i] ? `corner ${i + 1}: ${nameOf(rows[i].label)} → ${corners.quantity} = ${engApart(rows[i].v, corners.limits[0] ?? rows[i].v, corners.unit)}` : "");
  const failing = rows.filter((r) => !r.ok).length;
  return (
    <figure className="rounded border border-rule bg-panel p-2" data-testid="corner-chart">
      <UPlotChart options={options} data={data} label={`${corners.quantity} across the tolerance corners`} verdict={verdict} readout={readout}
        legend={<PlotLegend traces={[{ name: `${corners.quantity} at a corner`, color: GUIDE_INK.target }, { name: "nominal", color: COPPER }]} verdict={verdict} />}
        csv={{ fileName: `${corners.quantity}-corners.csv`, headers: ["corner", `${corners.quantity} (${corners.unit || "1"})`], columns: [rows.map((_, i) => i + 1), rows.map((r) => r.v)] }} />
      <figcaption className="mt-1 text-xs text-graphite">
        {corners.quantity} at {rows.length} tolerance corners for “{check.label}”: from {eng(rows[0]?.v ?? NaN, corners.unit)} to {eng(rows[rows.length - 1]?.v ?? NaN, corners.unit)}
        {relations.length ? `; ${failing ? `${failing} outside the limits` : "all inside the limits"}` : ""}.
      </figcaption>
      {corners.labels ? (
        <details className="mt-1 text-xs">
          <summary className="cursor-pointer text-graphite">Every corner by name</summary>
          <table className="mt-1 w-full" data-testid="corner-table">
            <thead className="text-left text-graphite"><tr><th className="pr-2 font-normal">#</th><th className="pr-2 font-normal">parameters at</th><th className="pr-2 text-right font-normal">{corners.quantity}</th><th className="font-normal"></th></tr></thead>
            <tbody>
              {rows.map((r, i) => (
                <tr key={i} className="border-t border-rule/50">
                  <td className="pr-2 tabular-nums">{i + 1}</td>
                  <td className="pr-2 font-mono">{nameOf(r.label)}</td>
                  <td className="pr-2 text-right font-mono tabular-nums">{engApart(r.v, corners.limits[0] ?? r.v, corners.unit)}</td>
                  <td style={{ color: relations.length ? (r.ok ? VERDICT_INK.pass : VERDICT_INK.fail) : undefined }}>{relations.length ? (r.ok ? "✓" : "✗ outside") : ""}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </details>
      ) : null}
    </figure>
  );
}
