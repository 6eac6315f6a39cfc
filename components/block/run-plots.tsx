"use client";
import { useMemo } from "react";
import type { Report, Waveform } from "@/checks";
import { BodePlot } from "@/components/plots/bode-plot";
import { CornerChart } from "@/components/plots/corner-chart";
import { groupWaveforms } from "@/components/plots/families";
import { Histogram } from "@/components/plots/histogram";
import { WaveformPlot } from "@/components/plots/waveform-plot";

/** Plots of the run's stored waveforms and of each checked quantity across its tolerance corners. */
export function RunPlots({ waveforms, checks, quantities = {} }: { waveforms: Waveform[]; checks: Report["checks"]; quantities?: Report["quantities"] }) {
  const groups = useMemo(() => groupWaveforms(waveforms), [waveforms]);
  const cornered = checks.filter((c) => c.corners && c.corners.values.length > 1);
  const sampled = Object.entries(quantities).filter(([, q]) => (q.samples?.length ?? 0) > 1);
  if (waveforms.length === 0 && cornered.length === 0 && sampled.length === 0) return <p className="text-sm text-graphite">This run stored no waveforms.</p>;
  return (
    <div className="space-y-4">
      {groups.map((g, i) => (g.wave.analysis === "ac"
        ? <BodePlot key={i} wave={g.wave} traces={g.traces} caption={g.caption} checks={checks} fileName={`ac-sweep-${i + 1}`} />
        : <WaveformPlot key={i} wave={g.wave} traces={g.traces} caption={g.caption} checks={checks} fileName={`${g.wave.analysis}-${i + 1}`} />))}
      {sampled.map(([name, q]) => (
        <Histogram key={name} name={name} unit={q.unit} samples={q.samples!}
          check={checks.find((c) => c.compared?.quantity === name) ?? checks.find((c) => c.corners?.quantity === name)} />
      ))}
      {cornered.map((c) => <CornerChart key={c.label} check={c} />)}
    </div>
  );
}
