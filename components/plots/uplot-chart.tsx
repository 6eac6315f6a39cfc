"use client";
import { useEffect, useRef } from "react";
import uPlot from "uplot";
import "uplot/dist/uPlot.min.css";

/** uPlot in a div that follows its container's width; options are rebuilt by the caller when data changes. */
export function UPlotChart({ options, data, label }: { options: Omit<uPlot.Options, "width">; data: uPlot.AlignedData; label: string }) {
  const box = useRef<HTMLDivElement>(null);
  useEffect(() => {
    const el = box.current;
    if (!el) return;
    const plot = new uPlot({ ...options, width: Math.max(260, el.clientWidth) } as uPlot.Options, data, el);
    const ro = new ResizeObserver(() => plot.setSize({ width: Math.max(260, el.clientWidth), height: options.height }));
    ro.observe(el);
    return () => {
      ro.disconnect();
      plot.destroy();
    };
  }, [options, data]);
  return <div ref={box} role="img" aria-label={label} className="w-full" data-testid="plot" />;
}
