import { randomUUID } from "node:crypto";
import type { EntityManager } from "@mikro-orm/postgresql";
import { encode, type JWT } from "next-auth/jwt";
import { EndedSessionSchema, UserSchema } from "@/entities";
import { SESSION_MAX_AGE_S, authSecret, sessionCookieName, useSecureCookies } from "./config";

// What a session cookie says about its sign-in, and whether that sign-in still counts.
// `signedInAt` (ms) is our own claim: next-auth re-encodes the cookie on every session read with a fresh `iat`,
// so `iat` says when the cookie was last refreshed, not when its holder proved who they are.

export interface SessionClaims {
  userId: number;
  signedInAt: number;
  /** This sign-in's own id, so signing out can end it alone; absent on cookies issued before it existed. */
  sid?: string;
}

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/;
/** A new sign-in's id. */
export const newSessionId = (): string => randomUUID();

/** The claim, else `iat` for a cookie issued before the claim existed (the first refresh pins it). */
export function signedInAt(token: JWT): number {
  if (typeof token.signedInAt === "number") return token.signedInAt;
  return typeof token.iat === "number" ? token.iat * 1000 : 0;
}

export function claimsOf(token: JWT | null): SessionClaims | null {
  const id = Number(token?.sub);
  if (!token || !Number.isInteger(id) || id <= 0) return null;
  const sid = typeof token.sid === "string" && UUID.test(token.sid) ? token.sid : undefined;
  return { userId: id, signedInAt: signedInAt(token), sid };
}

/** A sign-in before the user's `sessionsValidFrom` (their last password change) is over. */
export const stillValid = (validFrom: Date | null, at: number): boolean => !validFrom || at >= validFrom.getTime();

/** Ended by a password change (every session of the person) or by signing out (this one). */
export async function sessionIsCurrent(em: EntityManager, claims: SessionClaims): Promise<boolean> {
  const user = await em.findOne(UserSchema, { id: claims.userId });
  if (!user || !stillValid(user.sessionsValidFrom, claims.signedInAt)) return false;
  return !claims.sid || !(await em.count(EndedSessionSchema, { sid: claims.sid }));
}

/**
 * Signing out ends this session on the server: its cookie is refused from now on, wherever a copy of it is.
 * A cookie from before sessions had ids can only be ended with all of the person's sessions, as a password change does.
 */
export async function endSession(em: EntityManager, claims: SessionClaims): Promise<void> {
  const now = new Date();
  if (!claims.sid) {
    await em.nativeUpdate(UserSchema, { id: claims.userId }, { sessionsValidFrom: now });
    return;
  }
  await em.getConnection().execute(
    `insert into ended_sessions (sid, user_id, ended_at, expires_at) values (?, ?, ?, ?) on conflict do nothing`,
    [claims.sid, claims.userId, now, new Date(now.getTime() + SESSION_MAX_AGE_S * 1000)]);
  await em.nativeDelete(EndedSessionSchema, { expiresAt: { $lt: now } }); // their cookies have expired anyway
}

/**
 * A session cookie for someone who just proved who they are at `at` — the same token, name and options
 * next-auth's sign-in would set, so next-auth keeps refreshing it as its own.
 */
export async function sessionCookieFor(user: { id: number; email: string; name: string }, at: Date) {
  const token: JWT = { sub: String(user.id), name: user.name, email: user.email, signedInAt: at.getTime(), sid: newSessionId() };
  return {
    name: sessionCookieName(),
    value: await encode({ token, secret: authSecret(), maxAge: SESSION_MAX_AGE_S }),
    options: {
      httpOnly: true,
      sameSite: "lax" as const,
      path: "/",
      secure: useSecureCookies(),
      expires: new Date(Date.now() + SESSION_MAX_AGE_S * 1000),
    },
  };
}
