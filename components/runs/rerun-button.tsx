"use client";
import { useActionState } from "react";
import { rerunAction } from "@/lib/actions/runs";

export function RerunButton({ slug, version }: { slug: string; version: number }) {
  const [state, action, pending] = useActionState(rerunAction, {});
  return (
    <form action={action} className="mt-1 inline-flex flex-wrap items-center gap-2">
      <input type="hidden" name="slug" value={slug} />
      <input type="hidden" name="version" value={version} />
      <button type="submit" disabled={pending} className="rounded border border-copper/60 px-2 py-0.5 text-xs text-copper-dark hover:bg-copper-pale disabled:opacity-60">
        {pending ? "Queuing…" : `Verify v${version} again`}
      </button>
      <span aria-live="polite" className={`text-xs ${state.ok === false ? "text-brick" : "text-graphite"}`}>{state.message}</span>
    </form>
  );
}
