import type uPlot from "uplot";
import { eng } from "../eng";

export const INKS = ["#2b2b2a", "#2f5f8a", "#7a4b2a", "#4f6b3a", "#6e3d6b"];
export const COPPER_PALE = "rgba(176, 98, 58, 0.14)";
export const COPPER = "#b0623a";
export const VERDICT_INK = { pass: "#2f7f74", fail: "#a63d2f", error: "#6e3d6b", skipped: "#6b7380" } as const;
export const GUIDE_INK = { target: "#2b2b2a", band: "#6b7380", limit: "#6b7380" } as const;

const TICK_FONT = "11px 'IBM Plex Mono', monospace";

/** Axis width from its widest tick label, so the axis title never sits on the ticks. */
function fitSize(u: uPlot, values: string[] | null, axisIdx: number, cycle: number): number {
  const axis = u.axes[axisIdx] as uPlot.Axis & { _size?: number };
  if (cycle > 1 && axis._size) return axis._size;
  const widest = (values ?? []).reduce((a, v) => (v && v.length > a.length ? v : a), "");
  u.ctx.font = TICK_FONT;
  return Math.ceil(u.ctx.measureText(widest).width + 8 + 6);
}

/** An axis whose ticks read as engineering values (`2 ms`, `10 kHz`); y axes size themselves to their ticks. */
export function engAxis(unit: string, label: string, extra: Partial<uPlot.Axis> = {}, vertical = false): uPlot.Axis {
  return {
    label,
    stroke: "#4a4845",
    grid: { stroke: "#ece6dc", width: 1 },
    ticks: { stroke: "#ddd5c8", width: 1, size: 6 },
    font: TICK_FONT,
    labelFont: "12px Inter, sans-serif",
    labelSize: 18,
    labelGap: 2,
    gap: 4,
    values: (_u, splits) => splits.map((v) => (v == null ? "" : eng(v, unit, 3))),
    size: vertical ? fitSize : 40,
    ...extra,
  };
}
