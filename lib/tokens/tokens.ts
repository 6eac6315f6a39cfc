import type { EntityManager } from "@mikro-orm/postgresql";
import { ApiTokenSchema, type ApiToken, type TokenScope } from "@/entities";
import type { Caller } from "@/lib/auth/caller";
import { loadCaller } from "@/lib/auth/load-caller";
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

export async function revokeToken(em: EntityManager, id: number): Promise<void> {
  await em.nativeUpdate(ApiTokenSchema, { id, revokedAt: null }, { revokedAt: new Date() });
}

/** The Caller behind a Bearer token; a malformed, unknown, revoked or expired token is unauthenticated (401). */
export async function findTokenCaller(em: EntityManager, token: string, now = new Date()): Promise<Caller> {
  if (!isWellFormedToken(token)) throw new AppError("unauthenticated", "malformed API token");
  const row = await em.findOne(ApiTokenSchema, { hash: tokenHash(token) });
  if (!row) throw new AppError("unauthenticated", "unknown API token");
  if (row.revokedAt) throw new AppError("unauthenticated", "this API token was revoked");
  if (row.expiresAt && row.expiresAt.getTime() <= now.getTime()) throw new AppError("unauthenticated", "this API token has expired");
  if (!row.lastUsedAt || now.getTime() - row.lastUsedAt.getTime() >= LAST_USED_EVERY_MS) {
    await em.nativeUpdate(ApiTokenSchema, { id: row.id }, { lastUsedAt: now });
  }
  const caller = await loadCaller(em, row.user.id, { id: row.id, teamId: row.team.id, scope: row.scope });
  if (!caller.user) throw new AppError("unauthenticated", "the API token's user no longer exists");
  return caller;
}
