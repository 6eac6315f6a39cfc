import type { Metadata } from "next";
import { RetuneForm } from "@/components/retune/retune-form";
import { requireUser } from "@/lib/auth/session";
import { creatableTeams, loadBlockVersion } from "@/lib/blocks/page";
import { pageContext } from "@/lib/next-context";
import { orNotFound } from "../../../or-not-found";
import { sameFileUpToValues } from "./base-match";

export const metadata: Metadata = { title: "Retune or derive a variant" };
export const dynamic = "force-dynamic";

export default async function ForkPage({ params, searchParams }: {
  params: Promise<{ slug: string }>; searchParams: Promise<{ from?: string }>;
}) {
  const { slug } = await params;
  await requireUser(`/blocks/${slug}/fork`);
  const ctx = await pageContext();
  const from = Number((await searchParams).from) || undefined;
  const { block, allowed } = await orNotFound(loadBlockVersion(ctx, { slug, version: from }));
  const canEdit = allowed.editThisVersion;
  const whyNotVersion = !allowed.edit ? "you may not edit it" : canEdit ? undefined : `new versions start from the head, v${block.headVersion}`;
  const values = Object.fromEntries(block.params.map((p) => [p.name, p.value]));
  const head = block.version === block.headVersion ? block : (await orNotFound(loadBlockVersion(ctx, { slug }))).block;
  const headNames = new Set(head.params.map((p) => p.name));
  // Values the head's file knows; the preview sends all of them so an older version's values are what it computes.
  const baseValues = Object.fromEntries(Object.entries(values).filter(([k]) => headNames.has(k)));
  const exactPreview = head === block || sameFileUpToValues(head.text, block.text, values);
  const teams = creatableTeams(ctx.caller);
  return (
    <div className="space-y-4">
      <header>
        <p className="text-sm text-graphite">Retune or derive a variant</p>
        <h1 className="font-serif text-2xl font-semibold">{block.title} <span className="font-mono text-lg text-graphite">v{block.version}</span></h1>
        <p className="mt-1 max-w-prose text-sm text-graphite">
          Change values and watch the quantities and expression checks follow as you type. Simulated checks run when you save, or now with “Simulate these values” in the live preview.
        </p>
      </header>
      <RetuneForm
        slug={slug}
        version={block.version}
        params={block.params}
        quantities={retunable((block.report as { quantities?: Record<string, { simulated?: boolean }> } | null)?.quantities)}
        baseValues={baseValues}
        head={{ version: head.version, values: Object.fromEntries(head.params.map((p) => [p.name, p.value])) }}
        preview={exactPreview ? "exact" : { headVersion: head.version }}
        canEdit={canEdit}
        whyNotVersion={whyNotVersion}
        teams={teams}
        defaultTeam={teams.includes(block.team) ? block.team : teams[0]}
      />
    </div>
  );
}

// Retune solves hand formulas only: simulated quantities are not offered as targets.
const retunable = (q: Record<string, { simulated?: boolean }> | undefined) =>
  Object.entries(q ?? {}).filter(([, v]) => !v.simulated).map(([k]) => k);
