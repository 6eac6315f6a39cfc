import Link from "next/link";
import type { Lineage } from "@/lib/blocks/read";

export function LineagePanel({ lineage }: { lineage: Lineage }) {
  const { forkedFrom, parentNewerVersions, forks } = lineage;
  if (!forkedFrom && forks.length === 0) return <p className="text-sm text-graphite">An original block: not forked from another, and not forked yet.</p>;
  return (
    <div className="space-y-2 text-sm" data-testid="lineage">
      {forkedFrom ? (
        <p>
          Forked from <Link className="text-copper-dark underline" href={`/blocks/${forkedFrom.slug}/versions/${forkedFrom.version}`}>{forkedFrom.title} v{forkedFrom.version}</Link>
          {parentNewerVersions > 0 ? (
            <span className="block text-xs text-ochre">
              The parent has {parentNewerVersions} newer version{parentNewerVersions === 1 ? "" : "s"}:{" "}
              <Link className="underline" href={`/blocks/${forkedFrom.slug}`}>see the head</Link>.
            </span>
          ) : null}
        </p>
      ) : null}
      {forks.length ? (
        <div>
          <p className="text-graphite">Forks:</p>
          <ul className="list-disc pl-5">
            {forks.map((f) => <li key={f.slug}><Link className="text-copper-dark underline" href={`/blocks/${f.slug}`}>{f.title}</Link> <span className="text-xs text-graphite">from v{f.fromVersion}</span></li>)}
          </ul>
        </div>
      ) : null}
    </div>
  );
}
