import "server-only";
import type { NextAuthOptions } from "next-auth";
import CredentialsProvider from "next-auth/providers/credentials";
import { contextFor } from "@/lib/context";
import { withEm } from "@/lib/db/orm";
import { acceptInvitation } from "./invitations";
import { clientIp } from "./rate-limit";
import { claimsOf, endSession, newSessionId, sessionIsCurrent, signedInAt } from "./session-token";
import { authorizePassword, redeemSignInLink } from "./sign-in";
import { SESSION_MAX_AGE_S, appUrl, authSecret, useSecureCookies } from "./config";

// next-auth reads NEXTAUTH_URL for its own links; APP_URL is the one setting people change.
process.env.NEXTAUTH_URL ??= appUrl();

const str = (v: unknown): string => (typeof v === "string" ? v : "");
type Req = { headers?: Record<string, string | string[] | undefined> };

/**
 * next-auth's callbacks are an edge: each makes its own anonymous context (whoever signs in is not known yet).
 * Three ways in, all ending in a JWT session that holds only the user id (roles are read from the
 * database per request): a password, a one-time sign-in link, an invitation link.
 * A thrown error's message is what the sign-in form shows.
 */
export function authOptions(): NextAuthOptions {
  return {
    secret: authSecret(),
    session: { strategy: "jwt", maxAge: SESSION_MAX_AGE_S, updateAge: 24 * 3600 },
    useSecureCookies: useSecureCookies(),
    pages: { signIn: "/sign-in", error: "/sign-in", signOut: "/sign-out" },
    providers: [
      CredentialsProvider({
        id: "password",
        name: "E-mail and password",
        credentials: { email: { type: "email" }, password: { type: "password" } },
        authorize: async (c, req) =>
          authorizePassword(await contextFor(), { email: str(c?.email), password: str(c?.password) }, clientIp((req as Req).headers)),
      }),
      CredentialsProvider({
        id: "link",
        name: "Sign-in link",
        credentials: { token: { type: "text" } },
        authorize: async (c, req) => redeemSignInLink(await contextFor(), { token: str(c?.token) }, clientIp((req as Req).headers)),
      }),
      CredentialsProvider({
        id: "invitation",
        name: "Invitation",
        credentials: { token: { type: "text" }, name: { type: "text" }, password: { type: "password" } },
        authorize: async (c) =>
          acceptInvitation(await contextFor(), { token: str(c?.token), name: str(c?.name) || undefined, password: str(c?.password) || undefined }),
      }),
    ],
    events: {
      // next-auth only clears the browser's cookie; this makes every copy of it worthless.
      async signOut({ token }) {
        const claims = claimsOf(token);
        if (claims) await withEm((em) => endSession(em, claims));
      },
    },
    callbacks: {
      async jwt({ token, user }) {
        if (user) {
          token.sub = user.id;
          token.signedInAt = Date.now();
          token.sid = newSessionId();
          return token;
        }
        // Every later read of the cookie (next-auth's /session refreshes it): a sign-in from before the person's
        // last password change is over. The throw makes next-auth clear the cookie and answer "no session".
        token.signedInAt = signedInAt(token);
        const claims = claimsOf(token);
        if (!claims || !(await withEm((em) => sessionIsCurrent(em, claims)))) {
          throw new Error("session ended: signed out, or signed in before the last password change");
        }
        return token;
      },
      session({ session, token }) {
        if (session.user) (session.user as { id?: string }).id = token.sub;
        return session;
      },
    },
  };
}
