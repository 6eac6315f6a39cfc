import type { Metadata } from "next";
import { BlockEditor } from "@/components/editor/block-editor";
import { requireUser } from "@/lib/auth/session";
import { loadBlockVersion } from "@/lib/blocks/page";
import { pageContext } from "@/lib/next-context";
import { orNotFound } from "../../../or-not-found";

export const metadata: Metadata = { title: "Edit" };
export const dynamic = "force-dynamic";

export default async function EditPage({ params }: { params: Promise<{ slug: string }> }) {
  const { slug } = await params;
  await requireUser(`/blocks/${slug}/edit`);
  const { block, allowed, role } = await orNotFound(loadBlockVersion(await pageContext(), { slug }));
  // The server refuses anyway; say so before someone types into a file they cannot save.
  const readOnly = block.archived
    ? "This block is archived: it takes no new versions."
    : !allowed.edit
      ? `You ${!role ? `are not in ${block.team}` : role === "viewer" ? `are a viewer in ${block.team}` : `did not write this block`}, so you can read this file but not save it. Fork and retune makes a block of your own where you may create one.`
      : undefined;
  return (
    <div className="space-y-4">
      <header>
        <p className="text-sm text-graphite">Edit the block file</p>
        <h1 className="font-serif text-2xl font-semibold">{block.title} <span className="font-mono text-lg text-graphite">from v{block.version}</span></h1>
        <p className="mt-1 max-w-prose text-sm text-graphite">Frontmatter, note, netlist and check script in one file. The engine reads it as you type and marks the lines it cannot read.</p>
      </header>
      <BlockEditor slug={slug} baseVersion={block.version} initialText={block.text} readOnly={readOnly} />
    </div>
  );
}
