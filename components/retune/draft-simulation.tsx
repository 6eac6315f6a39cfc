"use client";
import { useEffect, useRef, useState } from "react";
import { CheckList } from "@/components/check-list";
import { draftRunOpen, useCancelDraftRun, useDraftRun, useStartDraftRun, type Draft, type DraftRunAnswer } from "@/lib/queries/draft-run";

const plural = (n: number, one: string, many = `${one}s`) => `${n} ${n === 1 ? one : many}`;

function statusLine(run: DraftRunAnswer | undefined, starting: boolean): string {
  if (starting || run?.status === "queued") return "waiting for the simulator…";
  if (!run) return "";
  const { done, total } = run.progress;
  if (run.status === "running") return total ? `simulating: ${done} of ${plural(total, "simulation")}` : "simulating: planning the simulations…";
  if (run.status === "cancelled") return run.error === "cancelled" || !run.error ? "cancelled; nothing was kept" : `cancelled: ${run.error}`;
  if (run.status === "error") return `could not simulate: ${run.error ?? "the engine stopped"}`;
  const report = run.report;
  if (!report) return "";
  if (report.errors.length) return "the draft could not be evaluated";
  const simulated = report.checks.filter((c) => c.simulated);
  const failing = simulated.filter((c) => c.status === "fail").length;
  const broken = simulated.filter((c) => c.status === "error").length;
  const after = ` after ${plural(total, "simulation")}`;
  if (simulated.length === 0) return "the script asks for no simulation";
  if (broken) return `${plural(broken, "simulated check")} could not be evaluated${after}`;
  return failing ? `${plural(failing, "simulated check")} ${failing === 1 ? "fails" : "fail"}${after}` : `every simulated check passes${after}`;
}

/**
 * The live preview's simulations on request: the draft is simulated in full (tolerance corners, sweeps, Monte
 * Carlo as its script says) without saving a version, with a count while it runs and a Cancel that stops it.
 * A result for other values than those on screen says so; leaving the page cancels a run still going.
 */
export function DraftSimulation({ slug, draft, disabled }: { slug: string; draft: Draft; disabled?: string }) {
  const [runId, setRunId] = useState<string | null>(null);
  const [simulatedFor, setSimulatedFor] = useState<string | null>(null);
  const start = useStartDraftRun(slug);
  const cancel = useCancelDraftRun();
  const run = useDraftRun(runId);
  const data = run.data;
  const open = start.isPending || draftRunOpen(data);
  const current = JSON.stringify(draft);
  const report = data?.status === "done" ? data.report : null;

  const openId = useRef<string | null>(null);
  openId.current = open ? runId : null;
  useEffect(() => () => {
    // Nobody will read the result: stop the simulations (keepalive lets the request outlive the page).
    if (openId.current) void fetch(`/api/v1/draft-runs/${encodeURIComponent(openId.current)}`, { method: "DELETE", keepalive: true }).catch(() => undefined);
  }, []);

  const simulate = () => start.mutate(draft, { onSuccess: (r) => { setRunId(r.id); setSimulatedFor(current); } });
  const { done, total } = data?.progress ?? { done: 0, total: 0 };
  const problem = start.error ?? cancel.error ?? run.error;

  return (
    <section aria-label="Simulated checks" className="space-y-2 border-t border-rule pt-3" data-testid="draft-simulation" data-status={start.isPending ? "starting" : data?.status ?? "idle"}>
      <div className="flex flex-wrap items-center gap-2">
        <h3 className="text-sm font-semibold">Simulated checks</h3>
        {open ? (
          <button type="button" onClick={() => runId && cancel.mutate(runId)} disabled={!runId || cancel.isPending}
            className="rounded border border-brick px-3 py-0.5 text-sm text-brick hover:bg-brick/10 disabled:opacity-50">
            {cancel.isPending ? "Cancelling…" : "Cancel"}
          </button>
        ) : (
          <button type="button" onClick={simulate} disabled={Boolean(disabled)} title={disabled}
            className="rounded border border-copper px-3 py-0.5 text-sm text-copper-dark hover:bg-copper/10 disabled:opacity-50">
            {report || data?.status === "cancelled" || data?.status === "error" ? "Simulate again" : "Simulate these values"}
          </button>
        )}
        <span aria-live="polite" className="text-xs text-graphite" data-testid="draft-sim-status">{statusLine(data, start.isPending)}</span>
      </div>
      {open && total > 0 ? (
        <progress max={total} value={done} className="h-1.5 w-full accent-copper" aria-label={`${done} of ${total} simulations done`} data-testid="draft-sim-progress" />
      ) : null}
      {!open && !data && !problem ? (
        <p className="text-xs text-graphite">
          {disabled ?? "Runs the simulations of these values at nominal and their tolerance corners, as a saved version would be checked; nothing is saved."}
        </p>
      ) : null}
      {problem ? <p role="alert" className="text-sm text-brick">{problem.message}</p> : null}
      {report ? (
        <div data-testid="draft-sim-report" className={simulatedFor !== current ? "opacity-70" : ""}>
          {simulatedFor !== current ? <p className="mb-1 text-xs text-ochre" data-testid="draft-sim-stale">These verdicts are for the values as they were when you pressed Simulate.</p> : null}
          {report.errors.length ? (
            <ul role="alert" className="mb-2 space-y-1 text-sm text-plum">{report.errors.map((e, i) => <li key={i}>{e.line ? `line ${e.line}: ` : ""}{e.message}</li>)}</ul>
          ) : null}
          {report.checks.some((c) => c.simulated) ? <CheckList checks={report.checks.filter((c) => c.simulated)} /> : null}
        </div>
      ) : null}
    </section>
  );
}
