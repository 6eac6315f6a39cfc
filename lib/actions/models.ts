"use server";
import "server-only";
import { revalidatePath } from "next/cache";
import { z } from "zod";
import { isAppError } from "@/lib/errors";
import { uploadModel } from "@/lib/models/upload";
import { actionContext } from "@/lib/next-context";
import { uploadFormSchema } from "@/lib/validation/models";
import type { FormState } from "./form-state";

/** The model page's upload: a new version of the file (the same rules as the API), then the blocks queued again. */
export async function uploadModelAction(_prev: FormState, form: FormData): Promise<FormState> {
  const ctx = await actionContext();
  if (!ctx.caller.user) return { ok: false, message: "Sign in to upload a model file." };
  const team = String(form.get("team") ?? "");
  const file = form.get("file");
  const text = file && typeof file !== "string" && file.size > 0 ? await file.text() : String(form.get("text") ?? "");
  const parsed = uploadFormSchema.safeParse({ name: form.get("name"), text, message: form.get("message") ?? undefined });
  if (!parsed.success) return { ok: false, message: "The file was not uploaded.", errors: z.flattenError(parsed.error).fieldErrors as Record<string, string[]> };
  let result;
  try {
    result = await uploadModel(ctx, { team, ...parsed.data });
  } catch (err) {
    if (!isAppError(err)) throw err;
    const lines = (err.extra.errors as { message: string; line?: number }[] | undefined) ?? [];
    return { ok: false, message: err.message, lines };
  }
  revalidatePath(`/models/${team}/${result.name}`);
  const queued = result.reverify.map((r) => r.slug);
  return {
    ok: true,
    message: `Version ${result.version} stored (sha256 ${result.sha256.slice(0, 12)}…).${queued.length ? ` Reverifying: ${queued.join(", ")}.` : ""}`,
    data: { version: result.version, reverify: queued },
  };
}
