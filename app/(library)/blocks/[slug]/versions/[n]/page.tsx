import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { BlockView } from "@/components/block/block-view";
import { loadBlockPage } from "@/lib/blocks/page";
import { pageContext } from "@/lib/next-context";
import { orNotFound } from "../../../../or-not-found";

export const dynamic = "force-dynamic";

export async function generateMetadata({ params }: { params: Promise<{ slug: string; n: string }> }): Promise<Metadata> {
  const { slug, n } = await params;
  return { title: `${slug} v${n}` };
}

export default async function VersionPage({ params }: { params: Promise<{ slug: string; n: string }> }) {
  const { slug, n } = await params;
  const version = Number(n);
  if (!Number.isInteger(version) || version < 1) notFound();
  return <BlockView model={await orNotFound(loadBlockPage(await pageContext(), { slug, version }))} />;
}
