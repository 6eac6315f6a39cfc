import { ApiTokenSchema, TeamSchema, type TokenScope } from "@/entities";
import type { Caller } from "@/lib/auth/caller";
import { can } from "@/lib/auth/permissions";
import type { Ctx } from "@/lib/context";
import { AppError } from "@/lib/errors";
import type { NewTokenInput, TokenRef } from "@/lib/validation/accounts";
import { createToken } from "./tokens";

// The settings page's token operations. Who may make tokens ("token.create") and who sees and revokes every token
// of a team ("token.manage") is lib/auth/permissions.ts's table; lib/tokens/rules.ts states it in words.
function person(caller: Caller) {
  if (!caller.user) throw new AppError("unauthenticated", "Sign in first.");
  if (caller.token) throw new AppError("forbidden", "API tokens cannot manage tokens.");
  return caller.user;
}

export interface TokenRow {
  id: number;
  name: string;
  prefix: string;
  team: string;
  scope: TokenScope;
  owner: string;
  mine: boolean;
  createdAt: Date;
  expiresAt: Date | null;
  lastUsedAt: Date | null;
  revokedAt: Date | null;
}

export async function createOwnToken({ em, caller }: Ctx, input: NewTokenInput, now = new Date()): Promise<{ token: string; id: number }> {
  const me = person(caller);
  const team = await em.findOne(TeamSchema, { slug: input.teamSlug });
  if (!team || !can(caller, "token.create", { kind: "team", teamId: team.id })) throw new AppError("not_found", "no such team");
  const expiresAt = input.expiresInDays > 0 ? new Date(now.getTime() + input.expiresInDays * 86400_000) : null;
  const { token, record } = await createToken(em, { userId: me.id, teamId: team.id, name: input.name, scope: input.scope, expiresAt });
  return { token, id: record.id };
}

export async function listTokens({ em, caller }: Ctx): Promise<TokenRow[]> {
  const me = person(caller);
  const adminOf = caller.memberships.filter((m) => can(caller, "token.manage", { kind: "team", teamId: m.teamId })).map((m) => m.teamId);
  const rows = await em.find(
    ApiTokenSchema,
    { $or: [{ user: me.id }, ...(adminOf.length ? [{ team: { $in: adminOf } }] : [])] },
    { populate: ["team", "user"], orderBy: { createdAt: "desc" } },
  );
  return rows.map((t) => ({
    id: t.id,
    name: t.name,
    prefix: t.prefix,
    team: t.team.slug,
    scope: t.scope,
    owner: t.user.email,
    mine: t.user.id === me.id,
    createdAt: t.createdAt,
    expiresAt: t.expiresAt,
    lastUsedAt: t.lastUsedAt,
    revokedAt: t.revokedAt,
  }));
}

export async function revokeTokenAs({ em, caller }: Ctx, { id }: TokenRef): Promise<void> {
  const me = person(caller);
  const t = await em.findOne(ApiTokenSchema, { id });
  const allowed = t && (t.user.id === me.id || can(caller, "token.manage", { kind: "team", teamId: t.team.id }));
  if (!t || !allowed) throw new AppError("not_found", "no such token");
  if (!t.revokedAt) t.revokedAt = new Date();
  await em.flush();
}
