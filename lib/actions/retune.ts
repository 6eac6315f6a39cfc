"use server";
import "server-only";
import { redirect } from "next/navigation";
import { revalidatePath } from "next/cache";
import { z } from "zod";
import { forkBlock } from "@/lib/blocks/fork";
import { addVersion } from "@/lib/blocks/versions";
import { actionContext } from "@/lib/next-context";
import { retuneFormSchema } from "@/lib/validation/blocks";
import { failure, type FormState } from "@/lib/actions/form-state";

/** Save retuned values: as a fork (a new block with lineage) or as the next version of this block. */
export async function saveRetuneAction(_prev: FormState, form: FormData): Promise<FormState> {
  const parsed = retuneFormSchema.safeParse(Object.fromEntries(form));
  if (!parsed.success) {
    return { ok: false, message: "Some fields need attention.", errors: z.flattenError(parsed.error).fieldErrors as Record<string, string[]> };
  }
  const ctx = await actionContext();
  if (!ctx.caller.user) return { ok: false, message: "Sign in to save." };
  const d = parsed.data;
  let target: string;
  try {
    const res = d.saveAs === "fork"
      ? await forkBlock(ctx, {
          source: d.source, fromVersion: d.fromVersion, params: d.params, slug: d.newSlug || undefined, title: d.title || undefined, team: d.team || undefined, message: d.message || undefined,
        })
      : await addVersion(ctx, { slug: d.source, params: d.params, baseVersion: d.fromVersion, message: d.message || "retuned" });
    target = `/blocks/${res.slug}`;
  } catch (err) {
    return failure(err, { slug: d.saveAs === "fork" ? "newSlug" : undefined });
  }
  revalidatePath("/");
  redirect(target);
}
