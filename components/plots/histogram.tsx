"use client";
import { useEffect, useRef, useState } from "react";
import type { Report } from "@/checks";
import { eng } from "../eng";
import { GUIDE_INK, INKS, VERDICT_INK } from "./axes";

type Check = Report["checks"][number];

const H = 200;
const PAD = { l: 44, r: 16, t: 26, b: 34 };

/** A Monte Carlo quantity as a histogram of its samples, the limits of the check that reads it dashed, with the yield. */
export function Histogram({ name, unit, samples, check }: { name: string; unit: string; samples: number[]; check?: Check }) {
  // Drawn at the figure's own width, so text keeps its size on a phone and on a wide screen.
  const box = useRef<HTMLElement>(null);
  const [W, setW] = useState(640);
  useEffect(() => {
    const el = box.current;
    if (!el) return;
    const ro = new ResizeObserver(() => setW(Math.max(280, el.clientWidth - 16)));
    ro.observe(el);
    return () => ro.disconnect();
  }, []);
  const finite = samples.filter(Number.isFinite);
  if (finite.length < 2) return null;
  const limits = check?.compared?.quantity === name ? check.compared.limits : check?.corners?.quantity === name ? check.corners.limits : [];
  const lo = Math.min(...finite, ...limits);
  const hi = Math.max(...finite, ...limits);
  const span = hi - lo || Math.abs(hi) || 1;
  const [x0, x1] = [lo - span * 0.05, hi + span * 0.05];
  // √N bins (common practice), between 8 and 40.
  const bins = Math.min(40, Math.max(8, Math.round(Math.sqrt(finite.length))));
  const [s0, s1] = [Math.min(...finite), Math.max(...finite)];
  const width = (s1 - s0 || span / bins) / bins;
  const counts = new Array<number>(bins).fill(0);
  for (const v of finite) counts[Math.min(bins - 1, Math.floor((v - s0) / width))]++;
  const top = Math.max(...counts);
  const px = (v: number) => PAD.l + ((v - x0) / (x1 - x0)) * (W - PAD.l - PAD.r);
  const py = (c: number) => H - PAD.b - (c / top) * (H - PAD.t - PAD.b);
  const rel = check?.compared?.relations ?? [];
  const outside = (v: number) => limits.some((l, i) => (rel[i] === ">" ? v <= l : rel[i] === "≥" ? v < l : rel[i] === "<" ? v >= l : rel[i] === "≤" ? v > l : false));
  const y = check?.yield;
  return (
    <figure ref={box} className="rounded border border-rule bg-panel p-2" data-testid="histogram">
      <svg viewBox={`0 0 ${W} ${H}`} width={W} height={H} className="max-w-full" role="img" aria-label={`${name} over ${finite.length} Monte Carlo samples`}>
        <line x1={PAD.l} x2={W - PAD.r} y1={H - PAD.b} y2={H - PAD.b} stroke="#ddd5c8" />
        {counts.map((c, i) => {
          const a = s0 + i * width;
          return <rect key={i} x={px(a) + 0.5} y={py(c)} width={Math.max(1, px(a + width) - px(a) - 1)} height={H - PAD.b - py(c)}
            fill={outside(a + width / 2) ? VERDICT_INK.fail : INKS[1]} opacity={0.75} />;
        })}
        {limits.map((l, i) => (
          <g key={i}>
            <line x1={px(l)} x2={px(l)} y1={PAD.t - 6} y2={H - PAD.b} stroke={GUIDE_INK.limit} strokeDasharray="4 3" strokeWidth={1.3} />
            <text x={px(l)} y={PAD.t - 10} fontSize={11} textAnchor="middle" fill={GUIDE_INK.limit} fontFamily="'IBM Plex Mono', monospace">{rel[i] ?? ""} {eng(l, unit, 4)}</text>
          </g>
        ))}
        {[x0 + (x1 - x0) * 0.1, (x0 + x1) / 2, x1 - (x1 - x0) * 0.1].map((v, i) => (
          <text key={i} x={px(v)} y={H - PAD.b + 14} fontSize={10} textAnchor="middle" fill="#4a4845" fontFamily="'IBM Plex Mono', monospace">{eng(v, unit, 3)}</text>
        ))}
        <text x={(W + PAD.l) / 2} y={H - 4} fontSize={12} textAnchor="middle" fill="#4a4845" fontFamily="Inter, sans-serif">{name}</text>
        <text x={PAD.l - 6} y={PAD.t + 4} fontSize={10} textAnchor="end" fill="#4a4845" fontFamily="'IBM Plex Mono', monospace">{top}</text>
      </svg>
      <figcaption className="mt-1 text-xs text-graphite">
        {name} over {finite.length} Monte Carlo samples{samples.length > finite.length ? ` (${samples.length - finite.length} could not be evaluated)` : ""}
        {y ? `; yield ${(100 * y.value).toFixed(1)} % (${(100 * y.lo).toFixed(1)}–${(100 * y.hi).toFixed(1)} %, ${y.interval})` : ""}
        {limits.length ? "; dashed: the check's limits, bars outside them in brick." : "."}
      </figcaption>
    </figure>
  );
}
