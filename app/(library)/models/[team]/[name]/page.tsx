import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { diffLines } from "diff";
import { DiffView } from "@/components/diff-view";
import { Hallmark } from "@/components/hallmark";
import { ModelUploadForm } from "@/components/models/model-upload-form";
import { can } from "@/lib/auth/permissions";
import { isAppError } from "@/lib/errors";
import { getModel, type ModelFile } from "@/lib/models/read";
import { pageContext } from "@/lib/next-context";

export const dynamic = "force-dynamic";
type Props = { params: Promise<{ team: string; name: string }>; searchParams: Promise<{ version?: string; from?: string; to?: string }> };

export async function generateMetadata({ params }: Props): Promise<Metadata> {
  return { title: (await params).name };
}

/** One model file: its text with line numbers, its versions with a diff, the blocks that include it, and the upload. */
export default async function ModelPage({ params, searchParams }: Props) {
  const { team, name } = await params;
  const q = await searchParams;
  const ctx = await pageContext();
  const load = (version?: number) => getModel(ctx, { team, name: decodeURIComponent(name), version }).catch((e) => {
    if (isAppError(e) && e.code === "not_found") notFound();
    throw e;
  });
  const file: ModelFile = await load(q.version ? Number(q.version) : undefined);
  const from = q.from ? await load(Number(q.from)) : null;
  const to = q.to ? await load(Number(q.to)) : null;
  const membership = ctx.caller.memberships.find((m) => m.teamSlug === team);
  const mayUpload = Boolean(membership && can(ctx.caller, "model.upload", { kind: "team", teamId: membership.teamId }));
  const lines = file.text.replace(/\n$/, "").split("\n");
  return (
    <div className="space-y-6">
      <header className="space-y-1">
        <p className="text-sm text-graphite"><Link href="/models" className="hover:underline">Model files</Link> / {team === "shared" ? "shared library" : team}</p>
        <h1 className="font-mono text-2xl font-semibold">{file.name}</h1>
        <p className="text-sm text-graphite">
          v{file.version}{file.version !== file.head ? ` (the newest is v${file.head})` : ""} · sha256 <span className="font-mono">{file.sha256}</span> ·
          defines {file.defines.map((d) => d.name).join(", ")}
        </p>
      </header>
      <div className="grid gap-8 lg:grid-cols-[minmax(0,1fr)_22rem]">
        <div className="min-w-0 space-y-6">
          {from && to ? (
            <DiffView title={`v${from.version} → v${to.version}`} parts={diffLines(from.text, to.text)} />
          ) : null}
          <section aria-label="File text" className="rounded border border-rule bg-panel">
            <h2 className="border-b border-rule px-3 py-1.5 text-sm font-semibold">Text of v{file.version}</h2>
            <pre className="max-h-[36rem] overflow-auto py-1 font-mono text-xs leading-5">
              {lines.map((l, i) => (
                <div key={i}><span aria-hidden className="inline-block w-10 select-none pr-2 text-right text-slate">{i + 1}</span>{l}</div>
              ))}
            </pre>
          </section>
        </div>
        <aside className="min-w-0 space-y-4">
          <section aria-label="Versions" className="rounded border border-rule bg-panel p-3 text-sm">
            <h2 className="mb-2 font-semibold">Versions</h2>
            <ul className="space-y-1">
              {file.versions.map((v, i) => (
                <li key={v.number}>
                  <Link className="text-copper-dark underline" href={`/models/${team}/${file.name}?version=${v.number}`}>v{v.number}</Link>{" "}
                  <span className="font-mono text-xs">{v.sha256.slice(0, 12)}</span> {v.author}{v.message ? ` — ${v.message}` : ""}
                  {file.versions[i + 1] ? (
                    <> · <Link className="text-copper-dark underline" href={`/models/${team}/${file.name}?from=${file.versions[i + 1].number}&to=${v.number}`}>diff with v{file.versions[i + 1].number}</Link></>
                  ) : null}
                </li>
              ))}
            </ul>
          </section>
          <section aria-label="Blocks that include it" className="rounded border border-rule bg-panel p-3 text-sm">
            <h2 className="mb-2 font-semibold">Blocks that include it</h2>
            {file.usedBy.length === 0 ? <p className="text-graphite">None that you can see.</p> : (
              <ul className="space-y-1">
                {file.usedBy.map((b) => (
                  <li key={b.slug} className="flex flex-wrap items-center gap-2">
                    <Hallmark badge={b.badge as never} version={b.version} id={`mu-${b.slug}`} />
                    <Link className="text-copper-dark underline" href={`/blocks/${b.slug}`}>{b.title}</Link>
                  </li>
                ))}
              </ul>
            )}
          </section>
          {mayUpload ? <ModelUploadForm team={team} name={file.name} reverify={file.usedBy.map((b) => b.slug)} /> : null}
        </aside>
      </div>
    </div>
  );
}
