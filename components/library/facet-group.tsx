"use client";

const LABELS: Record<string, string> = { category: "Category", badge: "State", tags: "Tag", team: "Team", approved: "Approval" };

/** One facet as a group of radio choices with their counts; "any" clears it. */
export function FacetGroup({ name, counts, value, onChange }: {
  name: string; counts: Record<string, number>; value: string | undefined; onChange: (v: string | undefined) => void;
}) {
  const entries = Object.entries(counts).sort((a, b) => b[1] - a[1] || a[0].localeCompare(b[0])).slice(0, 12);
  if (entries.length === 0 && !value) return null;
  const show = (v: string) => (name === "approved" ? (v === "true" ? "approved" : "not approved") : v);
  return (
    <fieldset className="min-w-0">
      <legend className="mb-1 text-xs font-semibold uppercase tracking-wide text-graphite">{LABELS[name] ?? name}</legend>
      <ul className="space-y-0.5 text-sm">
        <li>
          <label className="flex cursor-pointer items-center gap-2">
            <input type="radio" name={`facet-${name}`} checked={!value} onChange={() => onChange(undefined)} className="accent-copper" />
            <span>any</span>
          </label>
        </li>
        {entries.map(([v, n]) => (
          <li key={v}>
            <label className="flex cursor-pointer items-center gap-2">
              <input type="radio" name={`facet-${name}`} checked={value === v} onChange={() => onChange(v)} className="accent-copper" />
              <span className="truncate">{show(v)}</span>
              <span className="ml-auto font-mono text-xs text-graphite">{n}</span>
            </label>
          </li>
        ))}
      </ul>
    </fieldset>
  );
}
