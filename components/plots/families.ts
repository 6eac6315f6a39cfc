import uPlot from "uplot";
import type { Waveform } from "@/checks";
import { COPPER, INKS } from "./axes";
import { typesetUnits } from "../eng";

export type Trace = { name: string; color: string; dash?: number[] };
/** One plot: the waveforms of one group on a shared x axis (gaps where a member has no sample), each trace named. */
export type PlotGroup = { wave: Waveform; traces: Trace[]; caption: string };

const cornerName = (c: Record<string, string> | undefined) =>
  c ? typesetUnits(Object.entries(c).map(([k, v]) => `${k} ${v.replace(/^-/, "−")}`).join(", ")) : "";

/**
 * Waveforms with the same `group` go on one plot: the nominal trace with the worst corner's drawn dashed over it,
 * or a sweep's members each in its own ink, named by the swept value. Windows and marks come from the nominal.
 */
export function groupWaveforms(waves: Waveform[]): PlotGroup[] {
  const groups = new Map<string, Waveform[]>();
  waves.forEach((w, i) => {
    const key = w.group === undefined ? `solo-${i}` : `g-${w.group}`;
    groups.set(key, [...(groups.get(key) ?? []), w]);
  });
  return [...groups.values()].map((members) => {
    if (members.length === 1) {
      const w = members[0];
      return { wave: w, traces: w.series.map((s, i) => ({ name: s.node, color: INKS[i % INKS.length] })), caption: "" };
    }
    const nominal = members.find((m) => m.variant !== "worst" && m.variant !== "member") ?? members[0];
    const family = members.some((m) => m.variant === "member");
    // One table per waveform (x, each series' values, then each series' phase), joined on x.
    const tables = members.map((m) => [m.x, ...m.series.map((s) => s.values), ...m.series.map((s) => s.phase ?? m.x.map(() => null))] as uPlot.AlignedData);
    const joined = uPlot.join(tables);
    const series: Waveform["series"] = [];
    const traces: Trace[] = [];
    let col = 1;
    members.forEach((m, k) => {
      const n = m.series.length;
      m.series.forEach((s, j) => {
        const hasPhase = Boolean(s.phase?.length);
        series.push({ node: s.node, values: joined[col + j] as number[], ...(hasPhase ? { phase: joined[col + n + j] as number[] } : {}) });
        // A sweep's members at the worst corner are told apart by their swept value, as at nominal.
        const at = m.sweep ? `${m.sweep.name} = ${typesetUnits(m.sweep.text)}, ` : "";
        if (m.variant === "worst") traces.push({ name: `${s.node}, ${at}worst corner (${cornerName(m.corner)})`, color: COPPER, dash: [6, 4] });
        else if (m.variant === "member") traces.push({ name: `${s.node}, ${m.sweep?.name ?? "member"} = ${typesetUnits(m.sweep?.text ?? String(k + 1))}`, color: INKS[(k * n + j) % INKS.length] });
        else traces.push({ name: s.node, color: INKS[j % INKS.length] });
      });
      col += 2 * n;
    });
    const worst = members.find((m) => m.variant === "worst");
    const dashed = `the worst corner (${cornerName(worst?.corner)})`;
    // Count the sweep's values, not its traces: at the worst corner each member is drawn a second time, dashed.
    const caption = family
      ? `${members.filter((m) => m.variant === "member").length} members of a sweep over ${members.find((m) => m.sweep)?.sweep?.name ?? "a parameter"}.${worst ? ` Dashed: the same members at ${dashed}.` : ""}`
      : `Dashed: ${dashed} over the nominal trace.`;
    return { wave: { ...nominal, x: joined[0] as number[], series }, traces, caption };
  });
}
