import type uPlot from "uplot";
import { eng } from "../eng";

export const INKS = ["#2b2b2a", "#2f5f8a", "#7a4b2a", "#4f6b3a", "#6e3d6b"];
export const COPPER_PALE = "rgba(176, 98, 58, 0.14)";
export const COPPER = "#b0623a";

/** An axis whose ticks read as engineering values (`2 ms`, `10 kHz`). */
export function engAxis(unit: string, label: string, extra: Partial<uPlot.Axis> = {}): uPlot.Axis {
  return {
    label,
    stroke: "#4a4845",
    grid: { stroke: "#ece6dc", width: 1 },
    ticks: { stroke: "#ddd5c8", width: 1 },
    font: "11px 'IBM Plex Mono', monospace",
    labelFont: "12px Inter, sans-serif",
    values: (_u, splits) => splits.map((v) => (v == null ? "" : eng(v, unit, 3))),
    size: 56,
    ...extra,
  };
}
