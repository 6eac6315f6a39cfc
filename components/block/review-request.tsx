"use client";
import { useActionState } from "react";
import { requestReviewAction } from "@/app/(library)/blocks/[slug]/actions";

export function ReviewRequest({ slug, version }: { slug: string; version: number }) {
  const [state, action, pending] = useActionState(requestReviewAction, {});
  return (
    <form action={action} className="inline-flex items-center gap-2">
      <input type="hidden" name="slug" value={slug} />
      <input type="hidden" name="version" value={version} />
      <button type="submit" disabled={pending} className="rounded border border-rule bg-panel px-3 py-1 text-sm hover:border-copper disabled:opacity-60">
        Ask for review
      </button>
      <span aria-live="polite" className={`text-xs ${state.ok === false ? "text-brick" : "text-graphite"}`}>{state.message}</span>
    </form>
  );
}
