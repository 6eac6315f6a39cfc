"use server";
import "server-only";
import { revalidatePath } from "next/cache";
import { actionContext } from "@/lib/next-context";
import { createOwnToken, revokeTokenAs } from "@/lib/tokens/manage";
import { firstIssue, newToken, tokenRef } from "@/lib/validation/accounts";
import { failure, type FormState } from "@/lib/actions/form-state";

/** The new token travels back once in `data.token`; it is never stored or shown again. */
export async function createTokenAction(_prev: FormState, form: FormData): Promise<FormState> {
  const parsed = newToken.safeParse(Object.fromEntries(form));
  if (!parsed.success) return { ok: false, message: firstIssue(parsed.error) };
  const ctx = await actionContext();
  try {
    const { token } = await createOwnToken(ctx, parsed.data);
    revalidatePath("/settings/tokens");
    return { ok: true, message: "Token created. Copy it now: it is shown only this once.", data: { token, name: parsed.data.name } };
  } catch (err) {
    return failure(err);
  }
}

export async function revokeTokenAction(_prev: FormState, form: FormData): Promise<FormState> {
  const parsed = tokenRef.safeParse({ id: form.get("id") });
  if (!parsed.success) return { ok: false, message: "No such token." };
  const ctx = await actionContext();
  try {
    await revokeTokenAs(ctx, parsed.data);
  } catch (err) {
    return failure(err);
  }
  revalidatePath("/settings/tokens");
  return { ok: true, message: "Revoked." };
}
