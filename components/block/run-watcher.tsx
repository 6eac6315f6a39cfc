"use client";
import { useRouter } from "next/navigation";
import { useEffect } from "react";
import { Hallmark } from "@/components/hallmark";
import { useRun } from "@/lib/queries/run";
import { useLiveBadge } from "./live-badge";

/** While a version's run is queued or running, poll it; once it settles, reload the page with the stored report. */
export function RunWatcher({ runId, runStatus, badge, version, approved }: {
  runId: string | null; runStatus: string | null; badge: string; version: number; approved: boolean;
}) {
  const router = useRouter();
  const open = Boolean(runId) && (runStatus === "queued" || runStatus === "running");
  const run = useRun(runId ?? "", open);
  const settled = run.data?.status === "done" || run.data?.status === "error";
  useEffect(() => {
    if (open && settled) router.refresh();
  }, [open, settled, router]);
  const shown = open && run.data ? run.data.badge : badge;
  const live = useLiveBadge();
  useEffect(() => {
    if (live.badge !== shown) live.set(shown);
  }, [live, shown]);
  const progress = run.data?.progress;
  return (
    <span className="inline-flex items-center gap-2" aria-live="polite" data-testid="block-badge" data-badge={shown} data-run-open={String(open)}>
      <Hallmark badge={shown} version={version} approved={approved} id="block-mark" />
      {open && !settled ? <span className="ml-4 text-xs text-graphite">
        checks {run.data?.status ?? runStatus}…
        {progress?.total ? <span data-testid="run-progress"> {progress.done} of {progress.total} simulations</span> : null}
      </span> : null}
    </span>
  );
}
