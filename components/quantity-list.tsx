import type { Report } from "@/checks";
import { Decimal } from "./decimal";

export function QuantityList({ quantities }: { quantities: Report["quantities"] }) {
  const rows = Object.entries(quantities ?? {});
  if (rows.length === 0) return <p className="text-sm text-graphite">No quantities yet.</p>;
  return (
    <dl className="grid grid-cols-[auto_1fr] gap-x-3 gap-y-1 text-sm" data-testid="quantity-list">
      {rows.map(([name, q]) => (
        <div key={name} className="contents">
          <dt className="font-mono font-medium">{name}</dt>
          <dd data-quantity={name}>
            <Decimal text={q.text} />
            {q.simulated && <span className="ml-2 text-xs text-graphite">simulated</span>}
          </dd>
        </div>
      ))}
    </dl>
  );
}
