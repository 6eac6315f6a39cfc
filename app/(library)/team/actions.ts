"use server";
import { revalidatePath } from "next/cache";
import { z } from "zod";
import { inviteMember, withdrawInvitation } from "@/lib/auth/invitations";
import { getCaller } from "@/lib/auth/session";
import { changeRole, removeMember } from "@/lib/auth/teams";
import { withEm } from "@/lib/db/orm";
import { firstIssue, invitation, role, teamSlug } from "@/lib/validation/accounts";
import { failure, type FormState } from "@/lib/actions/form-state";

// Every action re-resolves the caller and the services check the admin role themselves.
const memberTarget = z.object({ teamSlug, userId: z.coerce.number().int().positive() });

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
  const parsed = memberTarget.extend({ role }).safeParse(Object.fromEntries(form));
  if (!parsed.success) return { ok: false, message: firstIssue(parsed.error) };
  const caller = await getCaller();
  const { teamSlug: slug, userId, role: r } = parsed.data;
  return run(() => withEm((em) => changeRole(em, caller, slug, userId, r)), `Role set to ${r}.`);
}

export async function removeMemberAction(_prev: FormState, form: FormData): Promise<FormState> {
  const parsed = memberTarget.safeParse(Object.fromEntries(form));
  if (!parsed.success) return { ok: false, message: firstIssue(parsed.error) };
  const caller = await getCaller();
  return run(() => withEm((em) => removeMember(em, caller, parsed.data.teamSlug, parsed.data.userId)), "Removed from the team.");
}

export async function inviteAction(_prev: FormState, form: FormData): Promise<FormState> {
  const parsed = invitation.safeParse(Object.fromEntries(form));
  if (!parsed.success) return { ok: false, message: firstIssue(parsed.error) };
  const caller = await getCaller();
  return run(() => withEm((em) => inviteMember(em, caller, parsed.data)), `Invitation mailed to ${parsed.data.email}.`);
}

export async function withdrawAction(_prev: FormState, form: FormData): Promise<FormState> {
  const parsed = z.object({ teamSlug, id: z.coerce.number().int().positive() }).safeParse(Object.fromEntries(form));
  if (!parsed.success) return { ok: false, message: firstIssue(parsed.error) };
  const caller = await getCaller();
  return run(() => withEm((em) => withdrawInvitation(em, caller, parsed.data.teamSlug, parsed.data.id)), "Invitation withdrawn.");
}
