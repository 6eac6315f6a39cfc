import type { EntityManager } from "@mikro-orm/postgresql";
import { MembershipSchema, TeamSchema, type Role, type Team } from "@/entities";
import type { Ctx } from "@/lib/context";
import { AppError } from "@/lib/errors";
import type { MemberTarget, RoleChange, TeamRef } from "@/lib/validation/accounts";
import type { Caller } from "./caller";
import { assertCan, roleIn } from "./permissions";

export interface MemberRow {
  userId: number;
  email: string;
  name: string;
  role: Role;
  since: Date;
}

/** The team named by slug, readable only by its members (others get 404, like team blocks). */
export async function teamForMember(em: EntityManager, caller: Caller, slug: string): Promise<Team> {
  const team = await em.findOne(TeamSchema, { slug });
  if (!team || !roleIn(caller, team.id)) throw new AppError("not_found", "no such team");
  return team;
}

export async function teamForAdmin(em: EntityManager, caller: Caller, slug: string): Promise<Team> {
  const team = await teamForMember(em, caller, slug);
  assertCan(caller, "team.manage", { kind: "team", teamId: team.id });
  return team;
}

export async function listMembers({ em, caller }: Ctx, { teamSlug }: TeamRef): Promise<MemberRow[]> {
  const team = await teamForAdmin(em, caller, teamSlug);
  const rows = await em.find(MembershipSchema, { team }, { populate: ["user"], orderBy: { user: { name: "asc" } } });
  return rows.map((m) => ({ userId: m.user.id, email: m.user.email, name: m.user.name, role: m.role, since: m.createdAt }));
}

/**
 * Every team keeps at least one admin: demoting or removing the last one is refused.
 * The admin rows are locked so two admins demoting each other at once cannot both succeed.
 */
async function assertNotLastAdmin(em: EntityManager, teamId: number, userId: number): Promise<void> {
  const admins: { user_id: number }[] = await em
    .getConnection()
    .execute(`select user_id from memberships where team_id = ? and role = 'admin' for update`, [teamId]);
  if (admins.length === 1 && admins[0].user_id === userId) {
    throw new AppError("conflict", "A team needs at least one admin: make someone else admin first.");
  }
}

export async function changeRole({ em, caller }: Ctx, { teamSlug, userId, role }: RoleChange): Promise<void> {
  const team = await teamForAdmin(em, caller, teamSlug);
  await em.transactional(async (tx) => {
    const m = await tx.findOne(MembershipSchema, { team, user: userId });
    if (!m) throw new AppError("not_found", "no such member");
    if (m.role === role) return;
    if (m.role === "admin") await assertNotLastAdmin(tx, team.id, userId);
    m.role = role;
  });
}

export async function removeMember({ em, caller }: Ctx, { teamSlug, userId }: MemberTarget): Promise<void> {
  const team = await teamForAdmin(em, caller, teamSlug);
  await em.transactional(async (tx) => {
    const m = await tx.findOne(MembershipSchema, { team, user: userId });
    if (!m) throw new AppError("not_found", "no such member");
    if (m.role === "admin") await assertNotLastAdmin(tx, team.id, userId);
    tx.remove(m);
  });
}

/** Teams the caller administers, for the team page's picker. */
export const adminTeams = (caller: Caller) => caller.memberships.filter((m) => roleIn(caller, m.teamId) === "admin");
