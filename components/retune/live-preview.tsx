"use client";
import { CheckList } from "@/components/check-list";
import { QuantityList } from "@/components/quantity-list";
import type { useEvaluateBlock } from "@/lib/queries/evaluate-block";
import { DraftSimulation } from "./draft-simulation";

/**
 * What the draft values give, recomputed as you type: quantities, then the checks that need no simulation, and
 * beneath, the simulated checks, run on request. Those are named once above the button rather than listed as
 * waiting cards, so the button is the next thing below the plain checks.
 */
export function LivePreview({ query, slug, values }: { query: ReturnType<typeof useEvaluateBlock>; slug: string; values: Record<string, string> }) {
  const report = query.data;
  const failing = report?.checks.filter((c) => c.status === "fail").length ?? 0;
  const errors = report?.errors ?? [];
  const plain = report?.checks.filter((c) => c.status !== "skipped") ?? [];
  const waiting = report?.checks.filter((c) => c.status === "skipped") ?? [];
  return (
    <section id="live-preview" aria-label="Live preview" className="scroll-mt-4 space-y-3 rounded border border-rule bg-panel p-3" data-testid="live-preview">
      <header className="flex items-baseline justify-between gap-2">
        <h2 className="text-xs font-semibold uppercase tracking-wide text-graphite">Live preview</h2>
        <span aria-live="polite" className="text-xs text-graphite" data-testid="preview-summary">
          {query.isError ? "preview failed" : !report ? "computing…" : errors.length ? "cannot evaluate" : failing ? `${failing} check${failing === 1 ? " fails" : "s fail"}` : "expression checks pass"}
          {query.isFetching ? " · updating" : ""}
        </span>
      </header>
      {query.isError ? <p role="alert" className="text-sm text-brick">{query.error.message}</p> : null}
      {errors.length ? (
        <ul role="alert" className="space-y-1 text-sm text-plum">{errors.map((e, i) => <li key={i}>{e.line ? `line ${e.line}: ` : ""}{e.message}</li>)}</ul>
      ) : null}
      {report ? (
        <div className={query.isPlaceholderData ? "opacity-70" : ""}>
          <h3 className="mb-1 text-sm font-semibold">Quantities</h3>
          <QuantityList quantities={report.quantities} />
          <h3 className="mb-1 mt-3 text-sm font-semibold">Checks</h3>
          {plain.length || !waiting.length ? <CheckList checks={plain} /> : null}
          {waiting.length ? (
            <p className="mt-2 text-xs text-graphite" data-testid="preview-waiting">
              {waiting.length} simulated check{waiting.length === 1 ? "" : "s"} run when you press “Simulate these values”:{" "}
              {waiting.map((c) => c.label).join("; ")}.
            </p>
          ) : null}
        </div>
      ) : null}
      <DraftSimulation slug={slug} draft={{ params: values }} disabled={errors.length ? "Fix the errors above first." : undefined} />
    </section>
  );
}
