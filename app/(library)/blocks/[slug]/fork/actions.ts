"use server";
import { redirect } from "next/navigation";
import { revalidatePath } from "next/cache";
import { z } from "zod";
import { getCaller } from "@/lib/auth/session";
import { forkBlock } from "@/lib/blocks/fork";
import { addVersion } from "@/lib/blocks/versions";
import { paramValuesSchema } from "@/lib/validation/blocks";
import { failure, type FormState } from "../../../form-state";

const retuneForm = z.object({
  source: z.string().regex(/^[a-z0-9-]{1,100}$/),
  fromVersion: z.coerce.number().int().min(1),
  saveAs: z.enum(["fork", "version"]),
  newSlug: z.string().trim().regex(/^[a-z0-9][a-z0-9-]{0,99}$/, "lowercase letters, digits and -").optional().or(z.literal("")),
  title: z.string().trim().max(200).optional(),
  team: z.string().trim().max(64).optional(),
  message: z.string().trim().max(2000).optional(),
  params: z.string().transform((s, ctx) => {
    try {
      return JSON.parse(s) as unknown;
    } catch {
      ctx.addIssue({ code: "custom", message: "the parameter values could not be read" });
      return z.NEVER;
    }
  }).pipe(paramValuesSchema),
});

/** Save retuned values: as a fork (a new block with lineage) or as the next version of this block. */
export async function saveRetuneAction(_prev: FormState, form: FormData): Promise<FormState> {
  const parsed = retuneForm.safeParse(Object.fromEntries(form));
  if (!parsed.success) {
    return { ok: false, message: "Some fields need attention.", errors: z.flattenError(parsed.error).fieldErrors as Record<string, string[]> };
  }
  const caller = await getCaller();
  if (!caller.user) return { ok: false, message: "Sign in to save." };
  const d = parsed.data;
  let target: string;
  try {
    const res = d.saveAs === "fork"
      ? await forkBlock(caller, d.source, {
          fromVersion: d.fromVersion, params: d.params, slug: d.newSlug || undefined, title: d.title || undefined, team: d.team || undefined,
        })
      : await addVersion(caller, d.source, { params: d.params, baseVersion: d.fromVersion, message: d.message || "retuned" });
    target = `/blocks/${res.slug}`;
  } catch (err) {
    return failure(err);
  }
  revalidatePath("/");
  redirect(target);
}
