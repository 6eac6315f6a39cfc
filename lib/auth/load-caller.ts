import type { EntityManager } from "@mikro-orm/postgresql";
import { MembershipSchema, UserSchema, type TokenScope } from "@/entities";
import { anonymous, type Caller } from "./caller";
import { sessionIsCurrent, type SessionClaims } from "./session-token";

export interface TokenBinding {
  id: number;
  teamId: number;
  scope: TokenScope;
}

/**
 * Builds a Caller from the database on every request, so a changed role or a removed membership
 * takes effect at once (the session cookie holds only the user id).
 * A token caller sees only the token's team.
 */
export async function loadCaller(em: EntityManager, userId: number, token?: TokenBinding | null): Promise<Caller> {
  const user = await em.findOne(UserSchema, { id: userId });
  if (!user) return anonymous;
  const rows = await em.find(
    MembershipSchema,
    token ? { user: userId, team: token.teamId } : { user: userId },
    { populate: ["team"], orderBy: { team: { slug: "asc" } } },
  );
  return {
    user: { id: user.id, email: user.email, name: user.name },
    memberships: rows.map((m) => ({ teamId: m.team.id, teamSlug: m.team.slug, role: m.role })),
    token: token ? { id: token.id, teamId: token.teamId, scope: token.scope } : null,
  };
}

/** The caller behind a session cookie: anonymous once it signed out or the person changed their password since. */
export async function loadSessionCaller(em: EntityManager, claims: SessionClaims): Promise<Caller> {
  if (!(await sessionIsCurrent(em, claims))) return anonymous;
  return loadCaller(em, claims.userId); // the user is in the identity map now: no second query
}
