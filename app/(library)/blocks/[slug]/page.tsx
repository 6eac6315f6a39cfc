import type { Metadata } from "next";
import { cache } from "react";
import { BlockView } from "@/components/block/block-view";
import { loadBlockPage } from "@/lib/blocks/page";
import { pageContext } from "@/lib/next-context";
import { orNotFound } from "../../or-not-found";

export const dynamic = "force-dynamic";

// generateMetadata and the page share one load per request.
const load = cache(async (slug: string) => loadBlockPage(await pageContext(), { slug }));

export async function generateMetadata({ params }: { params: Promise<{ slug: string }> }): Promise<Metadata> {
  const { slug } = await params;
  const model = await load(slug).catch(() => null);
  return { title: model?.block.title ?? "Block" };
}

export default async function BlockPage({ params }: { params: Promise<{ slug: string }> }) {
  const { slug } = await params;
  return <BlockView model={await orNotFound(load(slug))} />;
}
