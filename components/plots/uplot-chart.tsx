"use client";
import { useEffect, useRef, useState, type ReactNode } from "react";
import uPlot from "uplot";
import "uplot/dist/uPlot.min.css";
import { downloadText, plotCsv } from "./plot-csv";
import { VerdictLayer, type Geometry } from "./verdict-layer";
import type { Guide, Measured } from "./verdict-guides";

export type PlotVerdict = { guides: Guide[]; measured: Measured[] };

/**
 * uPlot in a div that follows its container's width, with what uPlot does not give: no default legend rows
 * (the caller passes its own), the checks' guides and marks drawn beside it with their labels in a gutter,
 * drag to zoom with a reset, and every plotted series as CSV.
 */
export function UPlotChart({ options, data, label, legend, csv, verdict, readout }: {
  options: Omit<uPlot.Options, "width">; data: uPlot.AlignedData; label: string; legend?: ReactNode;
  csv?: { fileName: string; headers: string[]; columns?: ArrayLike<number | null>[] }; verdict?: PlotVerdict;
  /** Words for the point under the cursor (our legend has no per-series value rows). */
  readout?: (idx: number) => string;
}) {
  const box = useRef<HTMLDivElement>(null);
  const plotRef = useRef<uPlot | null>(null);
  const [geom, setGeom] = useState<Geometry | null>(null);
  const [zoomed, setZoomed] = useState(false);
  const [hover, setHover] = useState("");
  const readoutRef = useRef(readout);
  readoutRef.current = readout;
  const gutter = verdict && verdict.guides.some((g) => g.axis === "y") ? 112 : 12;
  const xLabels = verdict ? verdict.guides.filter((g) => g.axis === "x").length + verdict.measured.filter((m) => m.y === null).length : 0;
  // Room above the plotting area for the rows of x-guide labels (about one row per three labels).
  const topBand = xLabels ? 12 + 13 * Math.min(4, Math.ceil(xLabels / 3)) : 10;

  useEffect(() => {
    const el = box.current;
    if (!el) return;
    const xs = data[0] as ArrayLike<number>;
    const full = { min: xs[0], max: xs[xs.length - 1] };
    const measure = (u: uPlot) => {
      const pr = uPlot.pxRatio;
      setGeom({
        left: u.bbox.left / pr, top: u.bbox.top / pr, width: u.bbox.width / pr, height: u.bbox.height / pr,
        x: (v) => u.valToPos(v, "x"), y: (v) => u.valToPos(v, "y"),
      });
    };
    const hooks: uPlot.Hooks.Arrays = {
      draw: [measure],
      setScale: [(u, key) => {
        if (key !== "x") return;
        const s = u.scales.x;
        setZoomed((s.min ?? full.min) > full.min * (1 + 1e-12) + 1e-300 || (s.max ?? full.max) < full.max * (1 - 1e-12));
      }],
      setCursor: [(u) => setHover(readoutRef.current && u.cursor.idx != null ? readoutRef.current(u.cursor.idx) : "")],
    };
    const opts = {
      ...options,
      width: Math.max(260, el.clientWidth),
      legend: { show: false },
      padding: [topBand, gutter, 0, 0],
      cursor: { drag: { x: true, y: false, setScale: true }, ...(options.cursor ?? {}) },
      hooks: { ...(options.hooks ?? {}), draw: [...(options.hooks?.draw ?? []), ...hooks.draw!], setScale: hooks.setScale, setCursor: hooks.setCursor },
    } as uPlot.Options;
    const plot = new uPlot(opts, data, el);
    plotRef.current = plot;
    const ro = new ResizeObserver(() => plot.setSize({ width: Math.max(260, el.clientWidth), height: options.height }));
    ro.observe(el);
    return () => {
      ro.disconnect();
      plot.destroy();
      plotRef.current = null;
    };
  }, [options, data, gutter, topBand]);

  const reset = () => {
    const xs = data[0] as ArrayLike<number>;
    plotRef.current?.setScale("x", { min: xs[0], max: xs[xs.length - 1] });
  };
  const download = () => csv && downloadText(plotCsv(csv.headers, csv.columns ?? (data as ArrayLike<number | null>[])), csv.fileName);

  return (
    <div className="space-y-1">
      <div className="relative">
        <div ref={box} role="img" aria-label={label} className="w-full" data-testid="plot" />
        {verdict && geom ? <VerdictLayer verdict={verdict} geom={geom} /> : null}
      </div>
      <div className="flex flex-wrap items-start justify-between gap-x-4 gap-y-1 text-xs">
        <div className="min-w-0 flex-1">{legend}</div>
        <div className="flex shrink-0 items-center gap-2">
          <span className="hidden text-graphite sm:inline">{zoomed ? "" : "drag across to zoom"}</span>
          {zoomed ? <button type="button" onClick={reset} className="rounded border border-rule px-2 py-0.5 hover:border-copper">Reset zoom</button> : null}
          {csv ? <button type="button" onClick={download} className="rounded border border-rule px-2 py-0.5 hover:border-copper" data-testid="plot-csv">CSV</button> : null}
        </div>
      </div>
      <p className="min-h-4 font-mono text-xs text-graphite" aria-live="off" data-testid="plot-readout">{hover}</p>
    </div>
  );
}
