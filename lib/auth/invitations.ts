import { InvitationSchema, MembershipSchema, UserSchema } from "@/entities";
import type { Ctx } from "@/lib/context";
import { AppError } from "@/lib/errors";
import { sendMail } from "@/lib/mail/mailer";
import { invitationMessage } from "@/lib/mail/messages";
import { randomSecret, sha256Hex } from "@/lib/tokens/secret";
import type { AcceptInvitationInput, InvitationInput, InvitationRef, LinkToken, TeamRef } from "@/lib/validation/accounts";
import { hashPassword } from "./passwords";
import { normaliseEmail, type SignedIn } from "./sign-in";
import { teamForAdmin } from "./teams";

export const INVITATION_DAYS = 7;

/** An admin invites an address to a team with a role; the link in the mail is the only copy of the token. */
export async function inviteMember({ em, caller }: Ctx, input: InvitationInput, now = new Date()): Promise<{ id: number }> {
  const team = await teamForAdmin(em, caller, input.teamSlug);
  const email = normaliseEmail(input.email);
  const existing = await em.findOne(MembershipSchema, { team, user: { email } });
  if (existing) throw new AppError("conflict", `${email} is already a member of ${team.name}.`);
  const token = randomSecret(32);
  const inv = em.create(InvitationSchema, {
    team,
    email,
    role: input.role,
    tokenHash: sha256Hex(token),
    invitedBy: caller.user!.id,
    expiresAt: new Date(now.getTime() + INVITATION_DAYS * 86400_000),
    acceptedAt: null,
    createdAt: now,
  });
  await em.flush();
  await sendMail({
    to: email,
    ...invitationMessage({ token, teamName: team.name, role: input.role, invitedBy: caller.user!.name, days: INVITATION_DAYS }),
  });
  return { id: inv.id };
}

export async function pendingInvitations({ em, caller }: Ctx, { teamSlug }: TeamRef, now = new Date()) {
  const team = await teamForAdmin(em, caller, teamSlug);
  const rows = await em.find(
    InvitationSchema,
    { team, acceptedAt: null, expiresAt: { $gt: now } },
    { populate: ["invitedBy"], orderBy: { createdAt: "desc" } },
  );
  return rows.map((i) => ({ id: i.id, email: i.email, role: i.role, invitedBy: i.invitedBy.name, expiresAt: i.expiresAt }));
}

export async function withdrawInvitation({ em, caller }: Ctx, { teamSlug, id }: InvitationRef): Promise<void> {
  const team = await teamForAdmin(em, caller, teamSlug);
  await em.nativeDelete(InvitationSchema, { id, team, acceptedAt: null });
}

const refused = () => new AppError("unauthenticated", "This invitation is not valid any more. Ask the team's admin for a new one.");

/** What the acceptance page shows before anyone types: the team, the role, whether an account exists. */
export async function describeInvitation({ em }: Ctx, { token }: LinkToken, now = new Date()) {
  const inv = await em.findOne(InvitationSchema, { tokenHash: sha256Hex(token) }, { populate: ["team"] });
  if (!inv || inv.acceptedAt || inv.expiresAt <= now) return null;
  const user = await em.findOne(UserSchema, { email: inv.email });
  return { email: inv.email, teamName: inv.team.name, teamSlug: inv.team.slug, role: inv.role, hasAccount: !!user };
}

/**
 * Accepting proves control of the invited mailbox, like a sign-in link: it adds the membership
 * (creating the account with name and password when there is none) and signs the person in.
 */
export async function acceptInvitation({ em }: Ctx, { token, ...account }: AcceptInvitationInput, now = new Date()): Promise<SignedIn> {
  if (!/^[A-Za-z0-9_-]{20,100}$/.test(token)) throw refused();
  return em.transactional(async (tx) => {
    const hash = sha256Hex(token);
    const taken = await tx.nativeUpdate(
      InvitationSchema,
      { tokenHash: hash, acceptedAt: null, expiresAt: { $gt: now } },
      { acceptedAt: now },
    );
    if (taken !== 1) throw refused();
    const inv = await tx.findOneOrFail(InvitationSchema, { tokenHash: hash }, { populate: ["team"] });
    let user = await tx.findOne(UserSchema, { email: inv.email });
    if (!user) {
      const name = account.name?.trim();
      if (!name) throw new AppError("validation", "Your name is needed to create the account.");
      if (!account.password || account.password.length < 10) {
        throw new AppError("validation", "Choose a password of at least 10 characters.");
      }
      user = tx.create(UserSchema, { email: inv.email, name, passwordHash: await hashPassword(account.password), createdAt: now });
    }
    const member = await tx.findOne(MembershipSchema, { user, team: inv.team });
    if (!member) tx.create(MembershipSchema, { user, team: inv.team, role: inv.role, createdAt: now });
    await tx.flush();
    return { id: String(user.id), email: user.email, name: user.name };
  });
}
