import type { Metadata } from "next";
import { Suspense } from "react";
import { BlockTable } from "@/components/block-table";
import { EmptyState } from "@/components/empty-state";
import { LibrarySearch } from "@/components/library/library-search";
import { failingInMyTeams, myBlocks, recentlyVerified } from "@/lib/blocks/lists";
import type { Ctx } from "@/lib/context";
import { pageContext } from "@/lib/next-context";
import { searchBlocks, type BlockSummary } from "@/lib/search/search";
import { searchQuerySchema, type SearchFilters } from "@/lib/validation/blocks";

export const metadata: Metadata = { title: "Library" };
export const dynamic = "force-dynamic";

const pick = (v: string | string[] | undefined) => (Array.isArray(v) ? v[0] : v) || undefined;
const FILTER_KEYS = ["q", "category", "badge", "tag", "team", "approved", "sort"] as const;

export default async function LibraryPage({ searchParams }: { searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  const sp = await searchParams;
  const filters: SearchFilters = Object.fromEntries(FILTER_KEYS.flatMap((k) => (pick(sp[k]) ? [[k, pick(sp[k])]] : [])));
  const ctx = await pageContext();
  // An address with a filter the API would refuse searches by its words alone, as before.
  const parsed = searchQuerySchema.safeParse({ ...filters, limit: 50 });
  const query = parsed.success ? parsed.data : searchQuerySchema.parse({ q: filters.q?.slice(0, 200), limit: 50 });
  const initial = await searchBlocks(ctx, query).catch(() => null);
  return (
    <div className="space-y-10">
      <header>
        <h1 className="font-serif text-3xl font-semibold">Library</h1>
        <p className="mt-1 max-w-prose text-graphite">Circuit blocks whose design equations, tolerance corners and simulations are checked on every version.</p>
      </header>
      <LibrarySearch initial={initial} initialFilters={filters} />
      {/* The three short lists do not depend on the search: they stream in after the results. */}
      <Suspense fallback={<div className="h-40" aria-hidden />}>
        <Lists ctx={ctx} />
      </Suspense>
    </div>
  );
}

async function Lists({ ctx }: { ctx: Ctx }) {
  const [mine, verified, failing] = await Promise.all([myBlocks(ctx), recentlyVerified(ctx, 8), failingInMyTeams(ctx)]);
  const signedIn = Boolean(ctx.caller.user);
  return (
    <div className="grid gap-8 lg:grid-cols-3">
      <ListSection title="Failing in my teams" rows={failing} empty={signedIn ? "Nothing failing: every head in your teams passes." : "Sign in to see your teams' blocks."} />
      <ListSection title="Recently verified" rows={verified} empty="No block has been verified yet." />
      <ListSection title="My blocks" rows={mine} empty={signedIn ? "You have not written a version yet. Fork a block to start." : "Sign in to see your blocks."} />
    </div>
  );
}

function ListSection({ title, rows, empty }: { title: string; rows: BlockSummary[]; empty: string }) {
  return (
    <section aria-label={title} className="min-w-0">
      <h2 className="mb-2 font-serif text-lg font-semibold">{title}</h2>
      {rows.length ? <BlockTable rows={rows.slice(0, 8)} caption={title} compact /> : <EmptyState title={empty} />}
    </section>
  );
}
