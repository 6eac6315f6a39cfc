"use client";
import { useActionState } from "react";
import { toggleWatchAction } from "@/lib/actions/block";
import { workVerb } from "./work-verb";

export function WatchButton({ slug, watching }: { slug: string; watching: boolean }) {
  const [state, action, pending] = useActionState(toggleWatchAction, {});
  return (
    <form action={action} className="inline-flex items-center">
      <input type="hidden" name="slug" value={slug} />
      <input type="hidden" name="watching" value={String(watching)} />
      <button type="submit" disabled={pending} aria-pressed={watching}
        className={workVerb} title="Mail me when its checks change or a version lands">
        <span aria-hidden className="font-mono text-xs text-copper">{watching ? "●" : "○"}</span>{watching ? "Following changes" : "Follow changes"}
      </button>
      <span aria-live="polite" className="px-2 text-xs text-graphite empty:hidden">{state.message}</span>
    </form>
  );
}
