"use server";
import "server-only";
import { revalidatePath } from "next/cache";
import { changePassword, updateName } from "@/lib/auth/profile";
import { restartSession } from "@/lib/auth/session";
import { actionContext } from "@/lib/next-context";
import { firstIssue, passwordChange, profileName } from "@/lib/validation/accounts";
import { failure, type FormState } from "@/lib/actions/form-state";

export async function updateNameAction(_prev: FormState, form: FormData): Promise<FormState> {
  const parsed = profileName.safeParse({ name: form.get("name") });
  if (!parsed.success) return { ok: false, message: firstIssue(parsed.error) };
  const ctx = await actionContext();
  try {
    await updateName(ctx, parsed.data);
  } catch (err) {
    return failure(err);
  }
  revalidatePath("/", "layout");
  return { ok: true, message: "Name saved." };
}

export async function changePasswordAction(_prev: FormState, form: FormData): Promise<FormState> {
  const parsed = passwordChange.safeParse(Object.fromEntries(form));
  if (!parsed.success) return { ok: false, message: firstIssue(parsed.error) };
  const ctx = await actionContext();
  try {
    const at = await changePassword(ctx, parsed.data);
    // The change ended every session signed in before it, this browser's too: sign it in again here.
    await restartSession(ctx.caller.user!, at);
  } catch (err) {
    return failure(err);
  }
  return { ok: true, message: "Password changed. Other browsers and devices are signed out." };
}
