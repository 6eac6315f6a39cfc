import { Decimal } from "./decimal";
import { typesetUnits } from "./eng";

export interface ParamRow { name: string; value: string; unit: string; tol: string | null; note: string | null }

export function ParamTable({ params }: { params: ParamRow[] }) {
  if (params.length === 0) return <p className="text-sm text-graphite">This block has no parameters.</p>;
  return (
    <table className="w-full text-sm" data-testid="param-table">
      <caption className="sr-only">Parameters</caption>
      <thead className="text-left text-xs uppercase tracking-wide text-graphite">
        <tr><th scope="col" className="py-1 pr-2 font-medium">Name</th><th scope="col" className="py-1 pr-2 font-medium">Value</th><th scope="col" className="py-1 font-medium">Tolerance</th></tr>
      </thead>
      <tbody>
        {params.map((p) => (
          <tr key={p.name} className="border-t border-rule/70 align-top">
            <th scope="row" className="py-1 pr-2 text-left font-mono font-medium">{p.name}</th>
            <td className="py-1 pr-2">
              <Decimal text={p.value} />
              {p.note ? <p className="text-xs text-graphite">{p.note}</p> : null}
            </td>
            <td className="py-1 font-mono text-xs">{p.tol ? `± ${typesetUnits(p.tol)}` : "—"}</td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}
