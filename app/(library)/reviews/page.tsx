import type { Metadata } from "next";
import { EmptyState } from "@/components/empty-state";
import { QueueEntryView } from "@/components/reviews/queue-entry";
import { can } from "@/lib/auth/permissions";
import { requireUser } from "@/lib/auth/session";
import { pageContext } from "@/lib/next-context";
import { reviewQueueWithChanges } from "@/lib/reviews/queue";

export const metadata: Metadata = { title: "Reviews" };
export const dynamic = "force-dynamic";

export default async function ReviewsPage() {
  const caller = await requireUser("/reviews");
  const queue = await reviewQueueWithChanges(await pageContext());
  const maintainer = caller.memberships.some((m) => can(caller, "version.approve", { kind: "team", teamId: m.teamId }));
  return (
    <div className="space-y-4">
      <h1 className="font-serif text-2xl font-semibold">Reviews</h1>
      <p className="max-w-prose text-sm text-graphite">
        Versions whose authors asked for a review, in the teams where you approve. Each shows its checks and what changed since the block's last approved version; read them, then approve or say what should change.
        Nobody approves their own version, and every new version needs approving again.
      </p>
      {queue.length === 0 ? (
        <EmptyState title={maintainer ? "Nothing waits for your review." : "Reviews are decided by maintainers."}>
          {maintainer ? "Requests appear here when an author asks for one." : "Authors ask for a review from a block's page."}
        </EmptyState>
      ) : (
        <ul className="space-y-4" data-testid="review-queue">
          {queue.map((r) => <QueueEntryView key={`${r.slug}-${r.version}`} entry={r} />)}
        </ul>
      )}
    </div>
  );
}
