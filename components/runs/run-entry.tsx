import Link from "next/link";
import { duration, when } from "@/components/eng";
import { Hallmark } from "@/components/hallmark";
import type { RunView } from "@/lib/runs/runs";
import { RunDetails } from "./run-details";

type ReportLike = { checks?: { label: string; status: string }[] };

const WHY: Record<string, string> = {
  "new-version": "a new version was saved",
  reverify: "the engine or a model file changed",
  manual: "a maintainer asked for it again",
};

const RAIL: Record<string, string> = {
  verified: "bg-verdigris border-verdigris", failing: "bg-brick border-brick", error: "bg-plum border-plum",
  pending: "bg-panel border-ochre border-dashed", stale: "bg-slate/40 border-slate", unchecked: "bg-panel border-hollow",
};

/** The verdict as a sentence: how many checks passed, and which ones did not. */
export function verdictOf(run: RunView): string {
  if (run.status === "queued") return "waiting for a worker";
  if (run.status === "running") return "checks running";
  if (run.status === "error") return run.error ? `could not finish: ${run.error}` : "could not finish";
  const checks = (run.report as ReportLike | null)?.checks ?? [];
  if (checks.length === 0) return "the script states no checks";
  const passed = checks.filter((c) => c.status === "pass").length;
  const bad = checks.filter((c) => c.status === "fail" || c.status === "error");
  if (bad.length === 0) return `${passed} of ${checks.length} checks pass`;
  return `${bad.length} of ${checks.length} check${checks.length === 1 ? "" : "s"} ${bad.length === 1 ? "does" : "do"} not pass: ${bad.map((c) => `“${c.label}”`).join(", ")}`;
}

/** One verification on the timeline: its mark, verdict, reason and timing, and how it ran behind a disclosure. */
export function RunEntry({ slug, run, action, open = false }: { slug: string; run: RunView; action?: React.ReactNode; open?: boolean }) {
  return (
    <li className="relative pl-7" data-testid="run-entry" data-badge={run.badge}>
      <span aria-hidden className={`absolute left-[3px] top-2 h-3 w-3 rotate-45 rounded-[2px] border-2 ${RAIL[run.badge] ?? RAIL.unchecked}`} />
      <div className="flex flex-wrap items-center gap-x-3 gap-y-1">
        <Hallmark badge={run.badge} version={run.version} id={`run-${run.id}`} />
        <span className="text-sm">{verdictOf(run)}</span>
      </div>
      <p className="mt-0.5 text-xs text-graphite">
        <Link className="text-copper-dark underline" href={`/blocks/${slug}/versions/${run.version}`}>v{run.version}</Link> verified because {WHY[run.trigger] ?? run.trigger}
        {" · "}<time dateTime={run.startedAt ?? run.createdAt}>{when(run.startedAt ?? run.createdAt)}</time>
        {run.durationMs != null ? <> · took <span className="tabular-nums">{duration(run.durationMs)}</span></> : null}
        {run.attempts > 1 ? ` · ${run.attempts} attempts` : ""}
      </p>
      {action}
      <RunDetails run={run} open={open} />
    </li>
  );
}
