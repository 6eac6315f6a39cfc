import Link from "next/link";
import { duration, when } from "@/components/eng";
import { Hallmark } from "@/components/hallmark";
import type { ReviewRow } from "@/lib/reviews/reviews";
import type { RunView } from "@/lib/runs/runs";
import { verdictOf } from "@/components/runs/run-entry";
import { Panel } from "./panel";

const DECISION: Record<string, string> = { requested: "sign-off requested", approved: "signed off", "changes-requested": "sent back for changes" };

/** The latest runs with their durations, and the review trail. */
export function HistoryPanel({ slug, runs, reviews }: { slug: string; runs: RunView[]; reviews: ReviewRow[] }) {
  return (
    <>
      <Panel title="Verifications">
        {runs.length === 0 ? <p className="text-sm text-graphite">No runs yet.</p> : (
          <ul className="space-y-1.5 text-sm">
            {runs.map((r) => (
              <li key={r.id}>
                <Hallmark badge={r.badge} version={r.version} id={`h-${r.id}`} />
                <p className="text-xs text-graphite">{verdictOf(r)} · {when(r.createdAt)} · <span className="tabular-nums">{duration(r.durationMs)}</span></p>
              </li>
            ))}
          </ul>
        )}
        <Link href={`/blocks/${slug}/runs`} className="mt-2 inline-block text-xs text-copper-dark underline">The whole verification record</Link>
      </Panel>
      <Panel title="Sign-offs">
        {reviews.length === 0 ? <p className="text-sm text-graphite">No sign-off asked yet.</p> : (
          <ul className="space-y-1.5 text-sm" data-testid="review-trail">
            {reviews.map((r) => (
              <li key={r.id}>
                <span className="font-mono text-xs">v{r.version}</span> {DECISION[r.decision] ?? r.decision}
                {r.reviewer ? ` by ${r.reviewer}` : r.requestedBy ? ` by ${r.requestedBy}` : ""}
                <span className="text-xs text-graphite"> · {when(r.createdAt)}</span>
                {r.comment ? <p className="text-xs text-graphite">“{r.comment}”</p> : null}
              </li>
            ))}
          </ul>
        )}
      </Panel>
    </>
  );
}
