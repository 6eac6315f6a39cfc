import type { Metadata } from "next";
import Link from "next/link";
import { duration, when } from "@/components/eng";
import { EmptyState } from "@/components/empty-state";
import { Hallmark } from "@/components/hallmark";
import { getCaller } from "@/lib/auth/session";
import { listRuns } from "@/lib/runs/runs";
import { orNotFound } from "../../../or-not-found";

export const metadata: Metadata = { title: "Runs" };
export const dynamic = "force-dynamic";

export default async function RunsPage({ params }: { params: Promise<{ slug: string }> }) {
  const { slug } = await params;
  const runs = await orNotFound(listRuns(await getCaller(), slug));
  return (
    <div className="space-y-4">
      <p className="text-sm"><Link href={`/blocks/${slug}`} className="text-copper-dark underline">{slug}</Link></p>
      <h1 className="font-serif text-2xl font-semibold">Runs</h1>
      <p className="max-w-prose text-sm text-graphite">Every check run of every version: new versions, engine or model-library changes and reruns.</p>
      {runs.length === 0 ? <EmptyState title="No runs yet." /> : (
        <div className="overflow-x-auto rounded border border-rule bg-panel">
          <table className="w-full text-sm" data-testid="run-history">
            <thead className="border-b border-rule text-left text-xs uppercase tracking-wide text-graphite">
              <tr><th className="px-3 py-2">Version</th><th className="px-3 py-2">Result</th><th className="px-3 py-2">Why</th><th className="px-3 py-2">Started</th><th className="px-3 py-2 text-right">Duration</th><th className="hidden px-3 py-2 md:table-cell">Engine</th></tr>
            </thead>
            <tbody>
              {runs.map((r) => (
                <tr key={r.id} className="border-b border-rule/60 last:border-0">
                  <td className="px-3 py-2"><Link className="font-mono text-copper-dark underline" href={`/blocks/${slug}/versions/${r.version}`}>v{r.version}</Link></td>
                  <td className="px-3 py-2"><Hallmark badge={r.badge} version={r.version} id={`run-${r.id}`} /> <span className="ml-1 text-xs text-graphite">{r.status}{r.attempts > 1 ? ` · ${r.attempts} attempts` : ""}</span>{r.error ? <p className="text-xs text-plum">{r.error}</p> : null}</td>
                  <td className="px-3 py-2">{r.trigger.replace(/-/g, " ")}</td>
                  <td className="whitespace-nowrap px-3 py-2 font-mono text-xs">{when(r.startedAt ?? r.createdAt)}</td>
                  <td className="px-3 py-2 text-right font-mono text-xs">{duration(r.durationMs)}</td>
                  <td className="hidden px-3 py-2 font-mono text-xs md:table-cell">{r.engineVersion ?? "—"} · {r.ngspiceVersion ?? "—"}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      )}
    </div>
  );
}
