"use client";
import type { useEvaluateBlock } from "@/lib/queries/evaluate-block";

/**
 * On a phone the live preview is a screen away from the fields: this strip sticks to the bottom of the screen
 * while the parameters are in view, with the verdict of the values being typed and the checks that fail.
 */
export function PreviewStrip({ query }: { query: ReturnType<typeof useEvaluateBlock> }) {
  const report = query.data;
  const failing = report?.checks.filter((c) => c.status === "fail") ?? [];
  const errors = report?.errors.length ?? 0;
  const tone = query.isError || errors ? "border-plum text-plum" : failing.length ? "border-brick text-brick" : "border-verdigris text-verdigris";
  return (
    <div className={`sticky bottom-0 z-10 -mx-3 mt-3 border-t-2 bg-panel/95 px-3 py-1.5 text-xs backdrop-blur lg:hidden ${tone}`} aria-live="polite" data-testid="preview-strip">
      <span className="font-semibold">
        {query.isError ? "preview failed" : !report ? "computing…" : errors ? "cannot evaluate" : failing.length ? `${failing.length} check${failing.length === 1 ? " fails" : "s fail"}` : "expression checks pass"}
      </span>
      {failing.length ? <span className="text-graphite">: {failing.map((c) => c.label).join("; ")}</span> : null}
      {query.isFetching ? <span className="text-graphite"> · updating</span> : null}
      <a href="#live-preview" className="ml-2 text-copper-dark underline">all of it</a>
    </div>
  );
}
