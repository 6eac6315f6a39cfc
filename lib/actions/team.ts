"use server";
import "server-only";
import { revalidatePath } from "next/cache";
import { inviteMember, withdrawInvitation } from "@/lib/auth/invitations";
import { changeRole, removeMember } from "@/lib/auth/teams";
import { actionContext } from "@/lib/next-context";
import { firstIssue, invitation, invitationRef, memberTarget, roleChange } from "@/lib/validation/accounts";
import { failure, type FormState } from "@/lib/actions/form-state";

// Every action re-resolves the caller and the services check the admin role themselves.

async function run(fn: () => Promise<unknown>, ok: string): Promise<FormState> {
  try {
    await fn();
  } catch (err) {
    return failure(err);
  }
  revalidatePath("/team");
  return { ok: true, message: ok };
}

export async function changeRoleAction(_prev: FormState, form: FormData): Promise<FormState> {
  const parsed = roleChange.safeParse(Object.fromEntries(form));
  if (!parsed.success) return { ok: false, message: firstIssue(parsed.error) };
  const ctx = await actionContext();
  return run(() => changeRole(ctx, parsed.data), `Role set to ${parsed.data.role}.`);
}

export async function removeMemberAction(_prev: FormState, form: FormData): Promise<FormState> {
  const parsed = memberTarget.safeParse(Object.fromEntries(form));
  if (!parsed.success) return { ok: false, message: firstIssue(parsed.error) };
  const ctx = await actionContext();
  return run(() => removeMember(ctx, parsed.data), "Removed from the team.");
}

export async function inviteAction(_prev: FormState, form: FormData): Promise<FormState> {
  const parsed = invitation.safeParse(Object.fromEntries(form));
  if (!parsed.success) return { ok: false, message: firstIssue(parsed.error) };
  const ctx = await actionContext();
  return run(() => inviteMember(ctx, parsed.data), `Invitation mailed to ${parsed.data.email}.`);
}

export async function withdrawAction(_prev: FormState, form: FormData): Promise<FormState> {
  const parsed = invitationRef.safeParse(Object.fromEntries(form));
  if (!parsed.success) return { ok: false, message: firstIssue(parsed.error) };
  const ctx = await actionContext();
  return run(() => withdrawInvitation(ctx, parsed.data), "Invitation withdrawn.");
}
