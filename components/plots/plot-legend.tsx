import { COPPER_PALE, GUIDE_INK, VERDICT_INK } from "./axes";
import type { PlotVerdict } from "./uplot-chart";

export type Trace = { name: string; color: string; dash?: number[] };

const Swatch = ({ color, dash, width = 2 }: { color: string; dash?: string; width?: number }) => (
  <svg width="22" height="8" aria-hidden className="mr-1 inline-block align-middle"><line x1="1" x2="21" y1="4" y2="4" stroke={color} strokeWidth={width} strokeDasharray={dash} /></svg>
);

/** Our legend: each trace by name, then only the kinds of guide and mark this plot actually carries. */
export function PlotLegend({ traces, verdict, windows = false }: { traces: Trace[]; verdict?: PlotVerdict; windows?: boolean }) {
  const roles = new Set(verdict?.guides.map((g) => g.role));
  const statuses = new Set(verdict?.measured.map((m) => m.status));
  return (
    <ul className="flex flex-wrap gap-x-4 gap-y-0.5 text-graphite" data-testid="plot-legend">
      {traces.map((t) => <li key={t.name}><Swatch color={t.color} dash={t.dash?.join(" ")} /><span className="font-mono text-ink">{t.name}</span></li>)}
      {windows ? <li><span aria-hidden className="mr-1 inline-block h-2.5 w-4 align-middle" style={{ background: COPPER_PALE }} />measured window</li> : null}
      {roles.has("target") ? <li><Swatch color={GUIDE_INK.target} dash="7 3" width={1.4} />target (hand value)</li> : null}
      {roles.has("band") ? <li><Swatch color={GUIDE_INK.band} dash="3 3" width={1.4} />tolerance band</li> : null}
      {roles.has("limit") ? <li><Swatch color={GUIDE_INK.limit} dash="3 3" width={1.4} />limit</li> : null}
      {statuses.has("pass") ? <li><Swatch color={VERDICT_INK.pass} width={3} />measured, passes</li> : null}
      {statuses.has("fail") ? <li><Swatch color={VERDICT_INK.fail} width={3} />measured, fails</li> : null}
    </ul>
  );
}
