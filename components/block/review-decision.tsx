"use client";
import { useRouter } from "next/navigation";
import { useActionState, useEffect, useId } from "react";
import { decideAction } from "@/lib/actions/block";

/** Approve a version, or ask for changes with a comment saying which. */
export function ReviewDecision({ slug, version, refresh = false }: { slug: string; version: number; refresh?: boolean }) {
  const [state, action, pending] = useActionState(decideAction, {});
  const id = useId();
  const router = useRouter();
  useEffect(() => {
    if (refresh && state.ok) router.refresh();
  }, [refresh, state, router]);
  return (
    <form action={action} className="space-y-2" aria-label={`Review v${version} of ${slug}`}>
      <input type="hidden" name="slug" value={slug} />
      <input type="hidden" name="version" value={version} />
      <label htmlFor={`${id}-comment`} className="block text-sm font-medium">Comment</label>
      <textarea id={`${id}-comment`} name="comment" rows={2} aria-describedby={`${id}-msg`}
        className="w-full rounded border border-rule bg-panel px-2 py-1 text-sm" placeholder="What you checked, or what should change" />
      {state.errors?.comment ? <p className="text-xs text-brick">{state.errors.comment[0]}</p> : null}
      <div className="flex flex-wrap gap-2">
        <button type="submit" name="decision" value="approved" disabled={pending}
          className="rounded bg-verdigris px-3 py-1 text-sm font-medium text-white hover:opacity-90 disabled:opacity-60">Approve</button>
        <button type="submit" name="decision" value="changes-requested" disabled={pending}
          className="rounded border border-brick px-3 py-1 text-sm font-medium text-brick hover:bg-brick/5 disabled:opacity-60">Request changes</button>
      </div>
      <p id={`${id}-msg`} aria-live="polite" className={`text-sm ${state.ok === false ? "text-brick" : "text-verdigris"}`}>{state.message}</p>
    </form>
  );
}
