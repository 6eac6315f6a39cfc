"use server";
import { revalidatePath } from "next/cache";
import { z } from "zod";
import { getCaller } from "@/lib/auth/session";
import { withEm } from "@/lib/db/orm";
import { createOwnToken, revokeTokenAs } from "@/lib/tokens/manage";
import { firstIssue, newToken } from "@/lib/validation/accounts";
import { failure, type FormState } from "@/lib/actions/form-state";

/** The new token travels back once in `data.token`; it is never stored or shown again. */
export async function createTokenAction(_prev: FormState, form: FormData): Promise<FormState> {
  const parsed = newToken.safeParse(Object.fromEntries(form));
  if (!parsed.success) return { ok: false, message: firstIssue(parsed.error) };
  const caller = await getCaller();
  try {
    const { token } = await withEm((em) => createOwnToken(em, caller, parsed.data));
    revalidatePath("/settings/tokens");
    return { ok: true, message: "Token created. Copy it now: it is shown only this once.", data: { token, name: parsed.data.name } };
  } catch (err) {
    return failure(err);
  }
}

export async function revokeTokenAction(_prev: FormState, form: FormData): Promise<FormState> {
  const id = z.coerce.number().int().positive().safeParse(form.get("id"));
  if (!id.success) return { ok: false, message: "No such token." };
  const caller = await getCaller();
  try {
    await withEm((em) => revokeTokenAs(em, caller, id.data));
  } catch (err) {
    return failure(err);
  }
  revalidatePath("/settings/tokens");
  return { ok: true, message: "Revoked." };
}
