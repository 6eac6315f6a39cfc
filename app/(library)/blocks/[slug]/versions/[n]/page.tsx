import type { Metadata } from "next";
import { cache } from "react";
import { notFound } from "next/navigation";
import { BlockView } from "@/components/block/block-view";
import { loadBlockPage } from "@/lib/blocks/page";
import { pageContext } from "@/lib/next-context";
import { orNotFound } from "../../../../or-not-found";

export const dynamic = "force-dynamic";

// generateMetadata and the page share one load per request; metadata resolves before the page streams
// (next.config htmlLimitedBots), so a missing or hidden version is an HTTP 404.
const load = cache(async (slug: string, n: string) => {
  const version = Number(n);
  if (!Number.isInteger(version) || version < 1) notFound();
  return orNotFound(loadBlockPage(await pageContext(), { slug, version }));
});

export async function generateMetadata({ params }: { params: Promise<{ slug: string; n: string }> }): Promise<Metadata> {
  const { slug, n } = await params;
  const model = await load(slug, n);
  return { title: `${model.block.title} v${n}` };
}

export default async function VersionPage({ params }: { params: Promise<{ slug: string; n: string }> }) {
  const { slug, n } = await params;
  return <BlockView model={await load(slug, n)} />;
}
