"use client";

export type ImportedParam = { name: string; value: string; unit: string; tol?: string };

const UNIT = { ohm: "Ω", F: "F", H: "H", V: "V", A: "A" } as Record<string, string>;

/** The block file's line for one parameter, as the import writes it, so an edit here rewrites that line in place. */
export function withParamLine(text: string, p: ImportedParam): string {
  const line = `  - { name: ${p.name}, value: ${p.value}${p.tol?.trim() ? `, tol: ${p.tol.trim()}` : ""} }`;
  return text.replace(new RegExp(`^  - \\{ name: ${p.name}, .*\\}$`, "m"), line);
}

/** The parameters the import found, each value and tolerance editable before the block is created. */
export function ImportParams({ params, onChange }: { params: ImportedParam[]; onChange: (p: ImportedParam) => void }) {
  if (params.length === 0) return null;
  const cell = "w-full rounded border border-rule bg-paper px-1.5 py-0.5 font-mono text-xs";
  return (
    <fieldset className="rounded border border-rule p-2" data-testid="import-params">
      <legend className="px-1 text-sm font-semibold">Parameters found ({params.length})</legend>
      <p className="mb-1 text-xs text-graphite">Each part and source value, written into the netlist as <code className="font-mono">{"{NAME}"}</code>. Tolerances are common defaults; change them here.</p>
      <table className="w-full text-sm">
        <thead className="text-left text-xs text-graphite"><tr><th className="font-normal">name</th><th className="font-normal">value</th><th className="font-normal">tolerance</th></tr></thead>
        <tbody>
          {params.map((p) => (
            <tr key={p.name}>
              <td className="pr-2 font-mono text-xs">{p.name} <span className="text-graphite">{UNIT[p.unit] ?? p.unit}</span></td>
              <td className="pr-2"><input aria-label={`${p.name} value`} className={cell} value={p.value} onChange={(e) => onChange({ ...p, value: e.target.value })} /></td>
              <td><input aria-label={`${p.name} tolerance`} className={cell} value={p.tol ?? ""} placeholder="none" onChange={(e) => onChange({ ...p, tol: e.target.value })} /></td>
            </tr>
          ))}
        </tbody>
      </table>
    </fieldset>
  );
}
