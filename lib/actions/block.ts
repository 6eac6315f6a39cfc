"use server";
import "server-only";
import { revalidatePath } from "next/cache";
import { z } from "zod";
import { actionContext } from "@/lib/next-context";
import { decide, requestReview } from "@/lib/reviews/reviews";
import { unwatch, watch } from "@/lib/watches/watches";
import { failure, type FormState } from "@/lib/actions/form-state";
import { decisionInputSchema, reviewTargetSchema, watchFormSchema } from "@/lib/validation/reviews";

export async function toggleWatchAction(_prev: FormState, form: FormData): Promise<FormState> {
  const parsed = watchFormSchema.safeParse(Object.fromEntries(form));
  if (!parsed.success) return { ok: false, message: "That block cannot be watched." };
  const ctx = await actionContext();
  if (!ctx.caller.user) return { ok: false, message: "Sign in to watch a block." };
  let state: FormState;
  try {
    const res = parsed.data.watching === "true" ? await unwatch(ctx, parsed.data) : await watch(ctx, parsed.data);
    state = { ok: true, message: res.watching ? "Following: you get mail when its checks change." : "No longer following." };
  } catch (err) {
    return failure(err);
  }
  revalidatePath(`/blocks/${parsed.data.slug}`);
  return state;
}

export async function requestReviewAction(_prev: FormState, form: FormData): Promise<FormState> {
  const parsed = reviewTargetSchema.safeParse(Object.fromEntries(form));
  if (!parsed.success) return { ok: false, message: "Pick a version to review." };
  const ctx = await actionContext();
  if (!ctx.caller.user) return { ok: false, message: "Sign in to ask for a review." };
  try {
    const r = await requestReview(ctx, parsed.data);
    return { ok: true, message: r.created ? "Sign-off requested from the team's maintainers." : "Sign-off of this version is already requested." };
  } catch (err) {
    return failure(err);
  }
}

export async function decideAction(_prev: FormState, form: FormData): Promise<FormState> {
  const parsed = decisionInputSchema.safeParse(Object.fromEntries(form));
  if (!parsed.success) return { ok: false, message: "Choose approve or request changes.", errors: z.flattenError(parsed.error).fieldErrors as Record<string, string[]> };
  if (parsed.data.decision === "changes-requested" && !parsed.data.comment)
    return { ok: false, message: "Say which changes you ask for.", errors: { comment: ["Say which changes you ask for."] } };
  const ctx = await actionContext();
  if (!ctx.caller.user) return { ok: false, message: "Sign in to review." };
  try {
    await decide(ctx, parsed.data);
  } catch (err) {
    return failure(err);
  }
  // No revalidatePath here: it would re-render the review queue at once and take the item, and this confirmation,
  // off the screen. Both pages are dynamic; the block page refreshes itself (see ReviewDecision).
  return { ok: true, message: parsed.data.decision === "approved" ? `Approved v${parsed.data.version}.` : `Changes requested on v${parsed.data.version}.` };
}
