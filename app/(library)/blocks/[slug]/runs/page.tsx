import type { Metadata } from "next";
import Link from "next/link";
import { EmptyState } from "@/components/empty-state";
import { RerunButton } from "@/components/runs/rerun-button";
import { RunEntry } from "@/components/runs/run-entry";
import { loadBlockVersion } from "@/lib/blocks/page";
import { pageContext } from "@/lib/next-context";
import { listRuns } from "@/lib/runs/runs";
import { orNotFound } from "../../../or-not-found";

export const metadata: Metadata = { title: "Verification record" };
export const dynamic = "force-dynamic";

export default async function RunsPage({ params }: { params: Promise<{ slug: string }> }) {
  const { slug } = await params;
  const ctx = await pageContext();
  const { block, allowed } = await orNotFound(loadBlockVersion(ctx, { slug }));
  const runs = await orNotFound(listRuns(ctx, { slug }));
  // The button sits on each version's latest verification, and not while one is waiting or running.
  const latest = new Set<string>();
  const seen = new Set<number>();
  for (const r of runs) if (!seen.has(r.version)) { seen.add(r.version); latest.add(r.id); }
  return (
    <div className="space-y-4">
      <p className="text-sm"><Link href={`/blocks/${slug}`} className="text-copper-dark underline">{block.title}</Link></p>
      <h1 className="font-serif text-2xl font-semibold">Verification record</h1>
      <p className="max-w-prose text-sm text-graphite">
        Each time the checks ran, newest first: for a new version, after an engine or model-file change, or because a maintainer asked.
      </p>
      {runs.length === 0 ? <EmptyState title="Not verified yet." /> : (
        <ol className="relative max-w-3xl space-y-4 before:absolute before:bottom-2 before:left-[8px] before:top-2 before:w-px before:bg-rule" data-testid="run-history">
          {runs.map((r, i) => (
            <RunEntry key={r.id} slug={slug} run={r} open={i === 0}
              action={allowed.rerun && latest.has(r.id) && (r.status === "done" || r.status === "error") ? <RerunButton slug={slug} version={r.version} /> : null} />
          ))}
        </ol>
      )}
    </div>
  );
}
