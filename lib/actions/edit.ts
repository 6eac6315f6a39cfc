"use server";
import "server-only";
import { redirect } from "next/navigation";
import { revalidatePath } from "next/cache";
import { z } from "zod";
import { slugSchema } from "@/lib/validation/api";
import { parseBlock, type BlockError } from "@/checks";
import { addVersion } from "@/lib/blocks/versions";
import { actionContext } from "@/lib/next-context";
import { editFormSchema, MAX_BLOCK_FILE_BYTES } from "@/lib/validation/blocks";
import { previewDraftFile } from "@/lib/runs/preview";
import { AppError, isAppError } from "@/lib/errors";
import { failure, type FormState } from "@/lib/actions/form-state";

/** The engine's word on a draft file, with line numbers: parse errors first, else the preview's errors and checks. */
export async function checkDraftAction(text: string, slug: string): Promise<{ errors: BlockError[]; failing: string[] }> {
  const ctx = await actionContext();
  if (!ctx.caller.user) return { errors: [{ message: "sign in to check a draft" }], failing: [] };
  const draft = String(text ?? "").slice(0, MAX_BLOCK_FILE_BYTES);
  const { errors } = parseBlock(draft);
  if (errors.length) return { errors, failing: [] };
  // The block's team decides which model files its includes name.
  const target = slugSchema.safeParse(slug);
  if (!target.success) throw new AppError("not_found", "no such block");
  const report = await previewDraftFile(ctx, { slug: target.data, text: draft });
  return {
    errors: [...report.errors, ...report.checks.filter((c) => c.status === "error").map((c) => ({ message: `${c.label}: ${c.detail}`, line: c.line }))],
    failing: report.checks.filter((c) => c.status === "fail").map((c) => c.label),
  };
}

export async function saveEditAction(_prev: FormState, form: FormData): Promise<FormState> {
  const parsed = editFormSchema.safeParse(Object.fromEntries(form));
  if (!parsed.success) return { ok: false, message: "The file could not be saved.", errors: z.flattenError(parsed.error).fieldErrors as Record<string, string[]> };
  const ctx = await actionContext();
  if (!ctx.caller.user) return { ok: false, message: "Sign in to save." };
  const { slug, baseVersion, text, message } = parsed.data;
  try {
    await addVersion(ctx, { slug, text, baseVersion, message: message || "edited" });
  } catch (err) {
    if (isAppError(err) && err.code === "conflict") {
      const head = (err.extra as { head?: number }).head;
      return { ok: false, head, message: `Someone saved v${head} while you were editing v${baseVersion}. Your text is kept here: compare the two, then carry your change into v${head} and save that.` };
    }
    return failure(err);
  }
  revalidatePath(`/blocks/${slug}`);
  redirect(`/blocks/${slug}`);
}
