"use server";
import "server-only";
import { revalidatePath } from "next/cache";
import { z } from "zod";
import { slugSchema } from "@/lib/validation/api";
import { getCaller } from "@/lib/auth/session";
import { decide, requestReview } from "@/lib/reviews/reviews";
import { unwatch, watch } from "@/lib/watches/watches";
import { failure, type FormState } from "@/lib/actions/form-state";

const target = z.object({ slug: slugSchema, version: z.coerce.number().int().min(1) });

export async function toggleWatchAction(_prev: FormState, form: FormData): Promise<FormState> {
  const parsed = target.pick({ slug: true }).extend({ watching: z.enum(["true", "false"]) }).safeParse(Object.fromEntries(form));
  if (!parsed.success) return { ok: false, message: "That block cannot be watched." };
  const caller = await getCaller();
  if (!caller.user) return { ok: false, message: "Sign in to watch a block." };
  let state: FormState;
  try {
    const res = parsed.data.watching === "true" ? await unwatch(caller, parsed.data.slug) : await watch(caller, parsed.data.slug);
    state = { ok: true, message: res.watching ? "Following: you get mail when its checks change." : "No longer following." };
  } catch (err) {
    return failure(err);
  }
  revalidatePath(`/blocks/${parsed.data.slug}`);
  return state;
}

export async function requestReviewAction(_prev: FormState, form: FormData): Promise<FormState> {
  const parsed = target.safeParse(Object.fromEntries(form));
  if (!parsed.success) return { ok: false, message: "Pick a version to review." };
  const caller = await getCaller();
  if (!caller.user) return { ok: false, message: "Sign in to ask for a review." };
  try {
    const r = await requestReview(caller, parsed.data.slug, parsed.data.version);
    return { ok: true, message: r.created ? "Sign-off requested from the team's maintainers." : "Sign-off of this version is already requested." };
  } catch (err) {
    return failure(err);
  }
}

const decision = target.extend({
  decision: z.enum(["approved", "changes-requested"]),
  comment: z.string().trim().max(5000).default(""),
});

export async function decideAction(_prev: FormState, form: FormData): Promise<FormState> {
  const parsed = decision.safeParse(Object.fromEntries(form));
  if (!parsed.success) return { ok: false, message: "Choose approve or request changes.", errors: z.flattenError(parsed.error).fieldErrors as Record<string, string[]> };
  if (parsed.data.decision === "changes-requested" && !parsed.data.comment)
    return { ok: false, message: "Say which changes you ask for.", errors: { comment: ["Say which changes you ask for."] } };
  const caller = await getCaller();
  if (!caller.user) return { ok: false, message: "Sign in to review." };
  try {
    await decide(caller, parsed.data.slug, parsed.data.version, parsed.data.decision, parsed.data.comment);
  } catch (err) {
    return failure(err);
  }
  // No revalidatePath here: it would re-render the review queue at once and take the item, and this confirmation,
  // off the screen. Both pages are dynamic; the block page refreshes itself (see ReviewDecision).
  return { ok: true, message: parsed.data.decision === "approved" ? `Approved v${parsed.data.version}.` : `Changes requested on v${parsed.data.version}.` };
}
