import { Family } from "../script/sweep";
import type { SimResult } from "../spice/types";
import type { Report, Waveform } from "./types";
import { pushOnce, type VariantRun } from "./variant";
import type { Done, Verification } from "./verification";

/**
 * The report's simulation list (one entry per distinct simulation, with the corner or sample it
 * served first) and the plots: every nominal simulation, and beside it the same simulation at
 * the worst corner of the simulated check with the least margin.
 */
export function waveformsOf(v: Verification, report: Report): { simulations: Report["simulations"]; waveforms: Waveform[] } {
  const simulations: Report["simulations"] = [];
  const listed = new Set<string>();
  for (const d of v.done.values())
    for (const key of d.simKeys) {
      const m = v.meta.get(key);
      if (!m || listed.has(key)) continue;
      listed.add(key);
      const { error: _error, ...entry } = m;
      simulations.push({ ...entry, corner: d.kind === "nominal" ? null : d.corner.label, ...(d.sample !== undefined ? { sample: d.sample } : {}) });
    }
  const waveforms: Waveform[] = [];
  const nominal = v.nominal()?.full;
  if (nominal) waveforms.push(...plots(v, nominal, "nominal"));
  const worst = worstPoint(v, report);
  if (worst?.full) waveforms.push(...plots(v, worst.full, "worst", worst.corner.label));
  return { simulations, waveforms };
}

function plots(v: Verification, run: VariantRun, variant: "nominal" | "worst", corner?: Record<string, string>): Waveform[] {
  const out: Waveform[] = [];
  run.sims.forEach((s, group) => {
    if (s.analysis.kind === "op") return;
    const one = (result: SimResult, extra: Partial<Waveform>) => {
      const w = v.side!.waveform(result, [...s.nodes]);
      if (!w) return;
      const windows = [...w.windows];
      for (const x of s.windows) pushOnce(windows, x);
      const marks = [...w.marks];
      for (const x of s.marks) pushOnce(marks, x);
      out.push({ ...w, windows, marks, group, variant, ...(corner ? { corner } : {}), ...extra });
    };
    if (!(s.result instanceof Family)) return one(s.result, {});
    // A sweep: one trace per value, drawn together (at nominal they are the family's members).
    const { sweep } = s.result;
    s.result.members.forEach((m, i) =>
      one(m as SimResult, { ...(variant === "nominal" ? { variant: "member" as const } : {}), sweep: { name: sweep.name, value: sweep.values[i], text: sweep.labels[i] } }),
    );
  });
  return out;
}

/** The corner (not a sample: its results are gone) where some simulated check has its least margin. */
function worstPoint(v: Verification, report: Report): Done | undefined {
  const sim = report.checks.map((c, j) => (c.simulated && c.status !== "skipped" ? j : -1)).filter((j) => j >= 0);
  let best: { d: Done; m: number } | undefined;
  for (const d of v.points())
    for (const j of sim) {
      const m = d.checks[j].margin;
      if (d.full && (!best || m < best.m)) best = { d, m };
    }
  return best?.d;
}
