import { eng } from "./eng";

type Row = { name: string; unit: string; from: number | null; to: number | null; simulated: boolean };

/** Change in percent of the earlier value; none when either side is missing or the earlier one is zero. */
export function changePercent(from: number | null, to: number | null): number | null {
  if (from === null || to === null || from === 0) return null;
  return (100 * (to - from)) / Math.abs(from);
}

/** Two versions' quantities side by side, with the change of each in percent. */
export function QuantityCompare({ rows, from, to }: { rows: Row[]; from: number; to: number }) {
  if (rows.length === 0) return <p className="text-sm text-graphite">Neither version's run reported a quantity.</p>;
  return (
    <div className="overflow-x-auto">
      <table className="rounded border border-rule bg-panel text-sm" data-testid="quantity-compare">
        <thead className="text-left text-xs text-graphite">
          <tr><th className="px-3 py-1 font-normal">quantity</th><th className="px-3 py-1 text-right font-normal">v{from}</th><th className="px-3 py-1 text-right font-normal">v{to}</th><th className="px-3 py-1 text-right font-normal">change</th></tr>
        </thead>
        <tbody>
          {rows.map((r) => {
            const pct = changePercent(r.from, r.to);
            const moved = pct !== null && Math.abs(pct) >= 0.05;
            return (
              <tr key={r.name} className="border-t border-rule">
                <th scope="row" className="px-3 py-1 text-left font-mono font-medium">{r.name}{r.simulated ? <span className="ml-1 font-sans text-xs font-normal text-graphite">simulated</span> : null}</th>
                <td className="px-3 py-1 text-right font-mono tabular-nums">{r.from === null ? "—" : eng(r.from, r.unit, 4)}</td>
                <td className="px-3 py-1 text-right font-mono tabular-nums">{r.to === null ? "—" : eng(r.to, r.unit, 4)}</td>
                <td className={`px-3 py-1 text-right font-mono tabular-nums ${moved ? "text-copper-dark" : "text-graphite"}`}>
                  {pct === null ? (r.from === null ? "new" : r.to === null ? "gone" : "—") : `${pct > 0 ? "+" : pct < 0 ? "−" : "±"}${Math.abs(pct).toFixed(Math.abs(pct) < 10 ? 2 : 1)} %`}
                </td>
              </tr>
            );
          })}
        </tbody>
      </table>
    </div>
  );
}
