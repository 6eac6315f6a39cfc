import { InvitationSchema, MembershipSchema, UserSchema } from "@/entities";
import type { Caller } from "@/lib/auth/caller";
import { can } from "@/lib/auth/permissions";
import type { Ctx } from "@/lib/context";
import type { StoredMail } from "./sink";

// The local sink holds everyone's sign-in links. An admin sees a message only when every recipient is someone
// they could act for anyway: themselves, a person all of whose teams they administer, or an address
// invited to one of their teams. Otherwise a Larkspur admin could read a Fenwick maintainer's link.
export function isMailboxViewer(caller: Caller): boolean {
  return !caller.token && caller.memberships.some((m) => can(caller, "team.manage", { kind: "team", teamId: m.teamId }));
}

/** Of the sink's mails, those this caller may read. */
export async function visibleMail({ em, caller }: Ctx, mails: StoredMail[]): Promise<StoredMail[]> {
  if (!caller.user || !isMailboxViewer(caller)) return [];
  const adminOf = new Set(caller.memberships.filter((m) => can(caller, "team.manage", { kind: "team", teamId: m.teamId })).map((m) => m.teamId));
  const addresses = [...new Set(mails.flatMap((m) => m.envelope.to.map((a) => a.toLowerCase())))];
  if (addresses.length === 0) return [];
  const users = await em.find(UserSchema, { email: { $in: addresses } });
  const memberships = await em.find(MembershipSchema, { user: { $in: users.map((u) => u.id) } });
  const invited = await em.find(InvitationSchema, { email: { $in: addresses }, team: { $in: [...adminOf] } });
  const allowed = new Set<string>([caller.user.email]);
  for (const u of users) {
    const teams = memberships.filter((m) => m.user.id === u.id).map((m) => m.team.id);
    if (teams.length > 0 && teams.every((t) => adminOf.has(t))) allowed.add(u.email);
  }
  const known = new Set(users.map((u) => u.email));
  for (const i of invited) if (!known.has(i.email)) allowed.add(i.email);
  return mails.filter((m) => m.envelope.to.length > 0 && m.envelope.to.every((a) => allowed.has(a.toLowerCase())));
}
