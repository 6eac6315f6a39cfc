import type { Metadata } from "next";
import { BlockView } from "@/components/block/block-view";
import { getCaller } from "@/lib/auth/session";
import { getBlock } from "@/lib/blocks/read";
import { orNotFound } from "../../or-not-found";

export const dynamic = "force-dynamic";

export async function generateMetadata({ params }: { params: Promise<{ slug: string }> }): Promise<Metadata> {
  const { slug } = await params;
  const block = await getBlock(await getCaller(), slug).catch(() => null);
  return { title: block?.title ?? "Block" };
}

export default async function BlockPage({ params }: { params: Promise<{ slug: string }> }) {
  const { slug } = await params;
  const caller = await getCaller();
  return orNotFound(BlockView({ caller, slug }));
}
