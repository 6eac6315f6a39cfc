import type { EntityManager } from "@mikro-orm/postgresql";
import { getToken } from "next-auth/jwt";
import { withEm } from "@/lib/db/orm";
import { AppError } from "@/lib/errors";
import { findTokenCaller } from "@/lib/tokens/tokens";
import { anonymous, type Caller } from "./caller";
import { loadSessionCaller } from "./load-caller";
import { claimsOf, type SessionClaims } from "./session-token";
import { authSecret, sessionCookieName, useSecureCookies } from "./config";

/** Cookie header → { name: value }; values stay as sent (next-auth's JWT is base64url, nothing to unescape). */
export function parseCookies(header: string | null | undefined): Record<string, string> {
  const out: Record<string, string> = {};
  for (const raw of (header ?? "").split(";")) {
    const part = raw.trim();
    const i = part.indexOf("=");
    if (i <= 0) continue;
    out[part.slice(0, i).trim()] = part.slice(i + 1).trim();
  }
  return out;
}

/**
 * The user id and sign-in time in a next-auth session cookie, or null when there is none or it does not decode
 * with our secret. Whether that sign-in still counts is the database's answer (loadSessionCaller).
 */
export async function sessionClaims(cookieHeader: string | null | undefined): Promise<SessionClaims | null> {
  const cookies = parseCookies(cookieHeader);
  const name = sessionCookieName();
  if (!Object.keys(cookies).some((k) => k.startsWith(name))) return null;
  const jwt = await getToken({
    req: { cookies, headers: {} } as never,
    secret: authSecret(),
    secureCookie: useSecureCookies(),
    cookieName: name,
  });
  return claimsOf(jwt);
}

/**
 * Who sent this request: a Bearer API token, else the session cookie, else anonymous.
 * Works on any WHATWG Request (route handlers, tests), not only inside Next.
 */
// One resolution per request: the route wrapper resolves the caller before the handler asks again.
const resolved = new WeakMap<Request, Promise<Caller>>();
export function callerFromRequest(req: Request): Promise<Caller> {
  let caller = resolved.get(req);
  if (!caller) resolved.set(req, (caller = resolveCaller(req)));
  return caller;
}

async function resolveCaller(req: Request): Promise<Caller> {
  return withEm((em) => callerFromRequestWith(em, req));
}

/** The same, reading through the request's own EntityManager (lib/context.ts). */
export async function callerFromRequestWith(em: EntityManager, req: Request): Promise<Caller> {
  const auth = req.headers.get("authorization");
  if (auth) {
    const m = /^Bearer\s+(\S+)\s*$/i.exec(auth);
    if (!m) throw new AppError("unauthenticated", "the Authorization header must be 'Bearer <token>'");
    return findTokenCaller(em, m[1]);
  }
  return callerFromCookieWith(em, req.headers.get("cookie"));
}

export async function callerFromCookieHeader(cookieHeader: string | null | undefined): Promise<Caller> {
  return withEm((em) => callerFromCookieWith(em, cookieHeader));
}

export async function callerFromCookieWith(em: EntityManager, cookieHeader: string | null | undefined): Promise<Caller> {
  const claims = await sessionClaims(cookieHeader);
  if (claims === null) return anonymous;
  return loadSessionCaller(em, claims);
}
