"use client";
import { useActionState } from "react";
import { toggleWatchAction } from "@/app/(library)/blocks/[slug]/actions";

export function WatchButton({ slug, watching }: { slug: string; watching: boolean }) {
  const [state, action, pending] = useActionState(toggleWatchAction, {});
  return (
    <form action={action} className="inline-flex items-center gap-2">
      <input type="hidden" name="slug" value={slug} />
      <input type="hidden" name="watching" value={String(watching)} />
      <button type="submit" disabled={pending} aria-pressed={watching}
        className="rounded border border-rule bg-panel px-3 py-1 text-sm hover:border-copper disabled:opacity-60">
        {watching ? "Watching ✓" : "Watch"}
      </button>
      <span aria-live="polite" className="text-xs text-graphite">{state.message}</span>
    </form>
  );
}
