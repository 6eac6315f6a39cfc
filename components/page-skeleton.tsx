/** The shape of a page while its data loads: a title bar, a reading column and a side column. */
export function PageSkeleton({ label = "Loading" }: { label?: string }) {
  return (
    <div role="status" aria-label={label} className="animate-pulse space-y-6">
      <div className="h-8 w-2/3 max-w-xl rounded bg-rule/60" />
      <div className="h-5 w-48 rounded bg-rule/50" />
      <div className="grid gap-8 lg:grid-cols-[minmax(0,70ch)_1fr]">
        <div className="space-y-3">{[...Array(8)].map((_, i) => <div key={i} className="h-4 rounded bg-rule/40" style={{ width: `${90 - (i % 3) * 12}%` }} />)}</div>
        <div className="space-y-3">{[...Array(3)].map((_, i) => <div key={i} className="h-28 rounded border border-rule bg-panel" />)}</div>
      </div>
      <span className="sr-only">{label}…</span>
    </div>
  );
}

/**
 * The loading state (loading.tsx) of a page that never answers 404. A page that can (a block and its subpages, a
 * model) has no loading boundary above it: behind one Next sends a 200 before the page knows the block is hidden
 * or missing.
 */
export default function PageLoading() {
  return <PageSkeleton />;
}
