"use client";
import type { Report, Waveform } from "@/checks";
import { BodePlot } from "@/components/plots/bode-plot";
import { CornerChart } from "@/components/plots/corner-chart";
import { WaveformPlot } from "@/components/plots/waveform-plot";

/** Plots of the run's stored waveforms and of each checked quantity across its tolerance corners. */
export function RunPlots({ waveforms, checks }: { waveforms: Waveform[]; checks: Report["checks"] }) {
  const cornered = checks.filter((c) => c.corners && c.corners.values.length > 1);
  if (waveforms.length === 0 && cornered.length === 0) return <p className="text-sm text-graphite">This run stored no waveforms.</p>;
  return (
    <div className="space-y-4">
      {waveforms.map((w, i) => (w.analysis === "ac" ? <BodePlot key={i} wave={w} checks={checks} fileName={`ac-sweep-${i + 1}`} /> : <WaveformPlot key={i} wave={w} checks={checks} fileName={`transient-${i + 1}`} />))}
      {cornered.map((c) => <CornerChart key={c.label} check={c} />)}
    </div>
  );
}
