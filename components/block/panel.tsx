import type { ReactNode } from "react";

/** A white data panel in the column of what was proven. */
export function Panel({ title, children, id }: { title: string; children: ReactNode; id?: string }) {
  return (
    <section aria-labelledby={id ?? undefined} aria-label={id ? undefined : title} className="rounded border border-rule bg-panel p-3">
      <h2 id={id} className="mb-2 text-xs font-semibold uppercase tracking-wide text-graphite">{title}</h2>
      {children}
    </section>
  );
}
