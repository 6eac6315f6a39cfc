import type { EntityManager } from "@mikro-orm/postgresql";
import { ApiTokenSchema, type ApiToken, type Role, type TokenScope } from "@/entities";
import type { Caller } from "@/lib/auth/caller";
import { AppError } from "@/lib/errors";
import { displayPrefix, isWellFormedToken, newTokenString, tokenHash } from "./format";

// lastUsedAt is a hint for people cleaning up tokens, not an audit log: written at most once a minute.
const LAST_USED_EVERY_MS = 60_000;

export interface NewToken {
  userId: number;
  teamId: number;
  name: string;
  scope: TokenScope;
  expiresAt: Date | null;
}

/** Creates a token; the returned `token` string exists only here, the database keeps its sha256. */
export async function createToken(em: EntityManager, input: NewToken): Promise<{ token: string; record: ApiToken }> {
  const token = newTokenString();
  const record = em.create(ApiTokenSchema, {
    user: input.userId,
    team: input.teamId,
    name: input.name,
    hash: tokenHash(token),
    prefix: displayPrefix(token),
    scope: input.scope,
    expiresAt: input.expiresAt,
    lastUsedAt: null,
    revokedAt: null,
    createdAt: new Date(),
  });
  await em.flush();
  return { token, record };
}

/** The Caller behind a Bearer token; a malformed, unknown, revoked or expired token is unauthenticated (401). */
export async function findTokenCaller(em: EntityManager, token: string, now = new Date()): Promise<Caller> {
  if (!isWellFormedToken(token)) throw new AppError("unauthenticated", "malformed API token");
  // Token, user and the membership in the token's team in one query (every API request by a script comes here).
  const [row] = (await em.getConnection().execute(
    `select k.id, k.team_id, k.scope, k.expires_at, k.last_used_at, k.revoked_at,
            u.id as user_id, u.email, u.name, m.role, mt.slug as team_slug
       from api_tokens k
       left join users u on u.id = k.user_id
       left join memberships m on m.user_id = k.user_id and m.team_id = k.team_id
       left join teams mt on mt.id = m.team_id
      where k.hash = ?`,
    [tokenHash(token)], "all", em.getTransactionContext(),
  )) as Record<string, unknown>[];
  if (!row) throw new AppError("unauthenticated", "unknown API token");
  if (row.revoked_at) throw new AppError("unauthenticated", "this API token was revoked");
  const expiresAt = row.expires_at ? new Date(row.expires_at as Date) : null;
  if (expiresAt && expiresAt.getTime() <= now.getTime()) throw new AppError("unauthenticated", "this API token has expired");
  const lastUsedAt = row.last_used_at ? new Date(row.last_used_at as Date) : null;
  if (!lastUsedAt || now.getTime() - lastUsedAt.getTime() >= LAST_USED_EVERY_MS) {
    await em.nativeUpdate(ApiTokenSchema, { id: Number(row.id) }, { lastUsedAt: now });
  }
  if (row.user_id === null || row.user_id === undefined) throw new AppError("unauthenticated", "the API token's user no longer exists");
  const teamId = Number(row.team_id);
  const scope = row.scope as TokenScope;
  // Same Caller as lib/auth/load-caller.ts loadCaller(em, userId, token) builds: only the token's team.
  return {
    user: { id: Number(row.user_id), email: String(row.email), name: String(row.name) },
    memberships: row.role ? [{ teamId, teamSlug: String(row.team_slug), role: row.role as Role }] : [],
    token: { id: Number(row.id), teamId, scope },
  };
}
