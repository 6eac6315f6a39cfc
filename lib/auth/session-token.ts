import type { EntityManager } from "@mikro-orm/postgresql";
import { encode, type JWT } from "next-auth/jwt";
import { UserSchema } from "@/entities";
import { SESSION_MAX_AGE_S, authSecret, sessionCookieName, useSecureCookies } from "./config";

// What a session cookie says about its sign-in, and whether that sign-in still counts.
// `signedInAt` (ms) is our own claim: next-auth re-encodes the cookie on every session read with a fresh `iat`,
// so `iat` says when the cookie was last refreshed, not when its holder proved who they are.

export interface SessionClaims {
  userId: number;
  signedInAt: number;
}

/** The claim, else `iat` for a cookie issued before the claim existed (the first refresh pins it). */
export function signedInAt(token: JWT): number {
  if (typeof token.signedInAt === "number") return token.signedInAt;
  return typeof token.iat === "number" ? token.iat * 1000 : 0;
}

export function claimsOf(token: JWT | null): SessionClaims | null {
  const id = Number(token?.sub);
  if (!token || !Number.isInteger(id) || id <= 0) return null;
  return { userId: id, signedInAt: signedInAt(token) };
}

/** A sign-in before the user's `sessionsValidFrom` (their last password change) is over. */
export const stillValid = (validFrom: Date | null, at: number): boolean => !validFrom || at >= validFrom.getTime();

export async function sessionIsCurrent(em: EntityManager, claims: SessionClaims): Promise<boolean> {
  const user = await em.findOne(UserSchema, { id: claims.userId });
  return !!user && stillValid(user.sessionsValidFrom, claims.signedInAt);
}

/**
 * A session cookie for someone who just proved who they are at `at` — the same token, name and options
 * next-auth's sign-in would set, so next-auth keeps refreshing it as its own.
 */
export async function sessionCookieFor(user: { id: number; email: string; name: string }, at: Date) {
  const token: JWT = { sub: String(user.id), name: user.name, email: user.email, signedInAt: at.getTime() };
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
