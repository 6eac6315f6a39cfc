import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { BlockView } from "@/components/block/block-view";
import { getCaller } from "@/lib/auth/session";
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
  const caller = await getCaller();
  return orNotFound(BlockView({ caller, slug, version }));
}
