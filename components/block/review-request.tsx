"use client";
import { useActionState } from "react";
import { requestReviewAction } from "@/lib/actions/block";
import { workVerb } from "./work-verb";

export function ReviewRequest({ slug, version }: { slug: string; version: number }) {
  const [state, action, pending] = useActionState(requestReviewAction, {});
  return (
    <form action={action} className="inline-flex items-center">
      <input type="hidden" name="slug" value={slug} />
      <input type="hidden" name="version" value={version} />
      <button type="submit" disabled={pending} className={workVerb} title="Ask the team's maintainers to sign off this version">
        <span aria-hidden className="font-mono text-xs text-copper">✓?</span>Request sign-off
      </button>
      <span aria-live="polite" className={`px-2 text-xs empty:hidden ${state.ok === false ? "text-brick" : "text-graphite"}`}>{state.message}</span>
    </form>
  );
}
