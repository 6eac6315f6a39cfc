"use client";
import { GUIDE_INK, VERDICT_INK } from "./axes";
import { rowLabels, spreadLabels } from "./verdict-guides";
import type { PlotVerdict } from "./uplot-chart";

/** The plotting area in CSS px within the chart, and value → px along each axis (relative to that area). */
export type Geometry = { left: number; top: number; width: number; height: number; x: (v: number) => number; y: (v: number) => number };

const DASH = { target: "7 3", band: "3 3", limit: "3 3" } as const;
const LABEL_GAP = 13;

/**
 * The checks drawn over a plot in SVG: dashed guides across the plotting area, each measured value as a bar over
 * its window in its verdict's colour, and every label in the gutter beside (or above) the area, pushed apart,
 * so no label lies across a trace or a guide.
 */
export function VerdictLayer({ verdict, geom }: { verdict: PlotVerdict; geom: Geometry }) {
  const { left, top, width, height } = geom;
  const right = left + width;
  const inside = (px: number, span: number) => px >= -0.5 && px <= span + 0.5;
  const ys = verdict.guides.filter((g) => g.axis === "y").map((g) => ({ g, at: geom.y(g.value) })).filter((o) => inside(o.at, height));
  const xs = verdict.guides.filter((g) => g.axis === "x").map((g) => ({ g, at: geom.x(g.value) })).filter((o) => inside(o.at, width));
  const marks = verdict.measured
    .map((m) => ({ m, x0: geom.x(m.x0), x1: geom.x(m.x1), y: m.y === null ? null : geom.y(m.y) }))
    .filter((o) => o.x1 >= 0 && o.x0 <= width);
  // One column of labels in the right gutter: guides and measured values together, in value order.
  const rightLabels = [...ys.map((o) => ({ y: o.at, text: o.g.text, color: GUIDE_INK[o.g.role], bold: false })),
    ...marks.filter((o) => o.y !== null).map((o) => ({ y: o.y!, text: o.m.text, color: VERDICT_INK[o.m.status], bold: true }))];
  const placed = spreadLabels(rightLabels.map((l) => l.y), LABEL_GAP, 6, height - 2);
  const topAll = [...xs.map((o) => ({ x: o.at, text: o.g.text, color: GUIDE_INK[o.g.role], bold: false })),
    ...marks.filter((o) => o.y === null).map((o) => ({ x: o.x0, text: o.m.text, color: VERDICT_INK[o.m.status], bold: true }))];
  // The same label twice (two checks on one start-up time) is written once.
  const topLabels = topAll.filter((l, i) => topAll.findIndex((k) => k.text === l.text && Math.abs(k.x - l.x) < 1) === i);
  const placedX = rowLabels(topLabels.map((l) => l.x), topLabels.map((l) => l.text.length * 7 + 4), width);

  return (
    <svg className="pointer-events-none absolute inset-0 h-full w-full overflow-visible" aria-hidden data-testid="verdict-layer">
      <g transform={`translate(${left} ${top})`}>
        {ys.map(({ g, at }, i) => (
          <line key={`y${i}`} x1={0} x2={width} y1={at} y2={at} stroke={GUIDE_INK[g.role]} strokeWidth={1.2} strokeDasharray={DASH[g.role]}
            data-role={g.role} data-value={g.value} data-check={g.check} />
        ))}
        {xs.map(({ g, at }, i) => (
          <line key={`x${i}`} x1={at} x2={at} y1={0} y2={height} stroke={GUIDE_INK[g.role]} strokeWidth={1.2} strokeDasharray={DASH[g.role]}
            data-role={g.role} data-value={g.value} data-check={g.check} />
        ))}
        {marks.map(({ m, x0, x1, y }, i) => {
          const color = VERDICT_INK[m.status];
          const cx = (Math.max(0, x0) + Math.min(width, x1)) / 2;
          return y === null ? (
            <path key={`m${i}`} d={`M${cx} 0 l-5 -7 h10 z`} fill={color} data-role="measured" data-status={m.status} data-check={m.check} />
          ) : (
            <g key={`m${i}`} data-role="measured" data-status={m.status} data-check={m.check} data-y={y}>
              <line x1={Math.max(0, x0)} x2={Math.min(width, x1)} y1={y} y2={y} stroke={color} strokeWidth={3} strokeLinecap="round" opacity={0.85} />
              <path d={`M${cx} ${y - 6} l6 6 l-6 6 l-6 -6 z`} fill={color} stroke="#fff" strokeWidth={1.2} />
            </g>
          );
        })}
      </g>
      {rightLabels.map((l, i) => (
        <g key={`rl${i}`}>
          <path d={`M${right} ${top + l.y} L${right + 6} ${top + placed[i]}`} stroke={l.color} strokeWidth={0.8} fill="none" />
          <text x={right + 8} y={top + placed[i] + 4} fontSize={11} fill={l.color} fontWeight={l.bold ? 600 : 400} fontFamily="'IBM Plex Mono', monospace">{l.text}</text>
        </g>
      ))}
      {topLabels.map((l, i) => (
        <text key={`tl${i}`} x={left + placedX[i].x} y={top - 6 - 13 * placedX[i].row} fontSize={11} fill={l.color} fontWeight={l.bold ? 600 : 400} fontFamily="'IBM Plex Mono', monospace">{l.text}</text>
      ))}
    </svg>
  );
}
