import type { Metadata } from "next";
import Link from "next/link";
import { ReviewDecision } from "@/components/block/review-decision";
import { when } from "@/components/eng";
import { EmptyState } from "@/components/empty-state";
import { Hallmark } from "@/components/hallmark";
import { can } from "@/lib/auth/permissions";
import { requireUser } from "@/lib/auth/session";
import { pageContext } from "@/lib/next-context";
import { reviewQueue } from "@/lib/reviews/reviews";

export const metadata: Metadata = { title: "Reviews" };
export const dynamic = "force-dynamic";

export default async function ReviewsPage() {
  const caller = await requireUser("/reviews");
  const queue = await reviewQueue(await pageContext());
  const maintainer = caller.memberships.some((m) => can(caller, "version.approve", { kind: "team", teamId: m.teamId }));
  return (
    <div className="space-y-4">
      <h1 className="font-serif text-2xl font-semibold">Reviews</h1>
      <p className="max-w-prose text-sm text-graphite">
        Versions whose authors asked for a review, in the teams where you approve. Read the block, then approve it or say what should change.
        Nobody approves their own version, and every new version needs approving again.
      </p>
      {queue.length === 0 ? (
        <EmptyState title={maintainer ? "Nothing waits for your review." : "Reviews are decided by maintainers."}>
          {maintainer ? "Requests appear here when an author asks for one." : "Authors ask for a review from a block's page."}
        </EmptyState>
      ) : (
        <ul className="space-y-4" data-testid="review-queue">
          {queue.map((r) => (
            <li key={`${r.slug}-${r.version}`} className="grid gap-4 rounded border border-rule bg-panel p-4 md:grid-cols-[1fr_22rem]">
              <div>
                <Link href={`/blocks/${r.slug}/versions/${r.version}`} className="font-serif text-lg font-semibold text-copper-dark hover:underline">{r.title}</Link>
                <p className="mt-1 flex flex-wrap items-center gap-2 text-sm text-graphite">
                  <Hallmark badge={r.badge} version={r.version} id={`rq-${r.slug}`} /> team {r.team} · asked by {r.requestedBy ?? "—"} on {when(r.requestedAt)}
                </p>
                <p className="mt-2 text-sm">
                  <Link className="text-copper-dark underline" href={`/blocks/${r.slug}/compare?b=${r.version}`}>What changed in v{r.version}</Link>
                </p>
              </div>
              <ReviewDecision slug={r.slug} version={r.version} />
            </li>
          ))}
        </ul>
      )}
    </div>
  );
}
