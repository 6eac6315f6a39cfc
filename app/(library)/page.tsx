import type { Metadata } from "next";
import { BlockTable } from "@/components/block-table";
import { EmptyState } from "@/components/empty-state";
import { LibrarySearch } from "@/components/library/library-search";
import { getCaller } from "@/lib/auth/session";
import { failingInMyTeams, myBlocks, recentlyVerified } from "@/lib/blocks/lists";
import type { SearchAnswer, SearchFilters } from "@/lib/queries/search-blocks";
import { searchBlocks, type SearchParams } from "@/lib/search/search";

export const metadata: Metadata = { title: "Library" };
export const dynamic = "force-dynamic";

const pick = (v: string | string[] | undefined) => (Array.isArray(v) ? v[0] : v) || undefined;

export default async function LibraryPage({ searchParams }: { searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  const sp = await searchParams;
  const filters: SearchFilters = {
    q: pick(sp.q), category: pick(sp.category), badge: pick(sp.badge), tag: pick(sp.tag), team: pick(sp.team),
    approved: pick(sp.approved), sort: pick(sp.sort),
  };
  const caller = await getCaller();
  const [initial, mine, verified, failing] = await Promise.all([
    searchBlocks(caller, { ...filters, approved: filters.approved ? filters.approved === "true" : undefined, limit: 50 } as SearchParams).catch(() => null),
    myBlocks(caller),
    recentlyVerified(caller, 8),
    failingInMyTeams(caller),
  ]);
  return (
    <div className="space-y-10">
      <header>
        <h1 className="font-serif text-3xl font-semibold">Library</h1>
        <p className="mt-1 max-w-prose text-graphite">Circuit blocks whose design equations, tolerance corners and simulations are checked on every version.</p>
      </header>
      <LibrarySearch initial={initial as SearchAnswer | null} initialFilters={filters} />
      <div className="grid gap-8 lg:grid-cols-3">
        <ListSection title="Failing in my teams" rows={failing} empty={caller.user ? "Nothing failing: every head in your teams passes." : "Sign in to see your teams' blocks."} />
        <ListSection title="Recently verified" rows={verified} empty="No block has been verified yet." />
        <ListSection title="My blocks" rows={mine} empty={caller.user ? "You have not written a version yet. Fork a block to start." : "Sign in to see your blocks."} />
      </div>
    </div>
  );
}

function ListSection({ title, rows, empty }: { title: string; rows: Awaited<ReturnType<typeof myBlocks>>; empty: string }) {
  return (
    <section aria-label={title} className="min-w-0">
      <h2 className="mb-2 font-serif text-lg font-semibold">{title}</h2>
      {rows.length ? <BlockTable rows={rows.slice(0, 8)} caption={title} compact /> : <EmptyState title={empty} />}
    </section>
  );
}
