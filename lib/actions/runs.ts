"use server";
import "server-only";
import { revalidatePath } from "next/cache";
import { z } from "zod";
import { actionContext } from "@/lib/next-context";
import { slugSchema } from "@/lib/validation/api";
import { rerunVersion } from "@/lib/runs/rerun";
import { failure, type FormState } from "@/lib/actions/form-state";

const target = z.object({ slug: slugSchema, version: z.coerce.number().int().min(1) });

/** A maintainer's "verify again" on the runs page. */
export async function rerunAction(_prev: FormState, form: FormData): Promise<FormState> {
  const parsed = target.safeParse(Object.fromEntries(form));
  if (!parsed.success) return { ok: false, message: "Pick a version to verify again." };
  const ctx = await actionContext();
  if (!ctx.caller.user) return { ok: false, message: "Sign in to verify again." };
  try {
    await rerunVersion(ctx, parsed.data);
  } catch (err) {
    return failure(err);
  }
  revalidatePath(`/blocks/${parsed.data.slug}/runs`);
  return { ok: true, message: `v${parsed.data.version} is queued to be verified again.` };
}
