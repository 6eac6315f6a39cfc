import type { Metadata } from "next";
import Link from "next/link";
import { EmptyState } from "@/components/empty-state";
import { ModelUploadForm } from "@/components/models/model-upload-form";
import { can } from "@/lib/auth/permissions";
import { listModels } from "@/lib/models/read";
import { pageContext } from "@/lib/next-context";

export const metadata: Metadata = { title: "Model files" };
export const dynamic = "force-dynamic";

/** The caller's teams' model files and the shared library, each with what it defines. */
export default async function ModelsPage() {
  const ctx = await pageContext();
  const { items } = await listModels(ctx);
  const uploadTeams = ctx.caller.memberships.filter((m) => can(ctx.caller, "model.upload", { kind: "team", teamId: m.teamId })).map((m) => m.teamSlug);
  const groups = [...new Set(items.map((m) => m.team))];
  return (
    <div className="space-y-6">
      <h1 className="font-serif text-2xl font-semibold">Model files</h1>
      <p className="max-w-prose text-sm text-graphite">
        Blocks pull these in with <code className="font-mono">.include NAME</code>: a team&apos;s own file of that name first, else the shared one.
        Every upload is a new version; the blocks that include a file are verified again with it.
      </p>
      {items.length === 0 ? <EmptyState title="No model files." /> : groups.map((team) => (
        <section key={team} aria-label={`${team} models`} className="space-y-2">
          <h2 className="font-serif text-lg font-semibold">{team === "shared" ? "Shared library" : `Team ${team}`}</h2>
          <ul className="divide-y divide-rule rounded border border-rule bg-panel">
            {items.filter((m) => m.team === team).map((m) => (
              <li key={m.name} className="flex flex-wrap items-baseline gap-x-4 gap-y-1 px-3 py-2 text-sm">
                <Link href={`/models/${m.team}/${m.name}`} className="font-mono text-copper-dark hover:underline">{m.name}</Link>
                <span className="text-graphite">v{m.version} · sha256 <span className="font-mono">{m.sha256.slice(0, 12)}</span></span>
                <span className="text-graphite">defines {m.defines.map((d) => `${d.name} (${d.kind === "subckt" ? "subcircuit" : `model ${d.type}`})`).join(", ") || "nothing"}</span>
              </li>
            ))}
          </ul>
        </section>
      ))}
      {uploadTeams.length ? <div className="grid gap-4 md:grid-cols-2">{uploadTeams.map((t) => <ModelUploadForm key={t} team={t} reverify={[]} />)}</div> : null}
    </div>
  );
}
