// Where the app lives and how its session cookie is named; shared by next-auth's options and callerFromRequest.
export function appUrl(): string {
  return (process.env.APP_URL ?? process.env.NEXTAUTH_URL ?? `http://127.0.0.1:${process.env.PORT ?? 3000}`).replace(/\/+$/, "");
}

/** Cookies carry `Secure` (and the `__Secure-` name prefix) whenever the app is served over https. */
export const useSecureCookies = (): boolean => appUrl().startsWith("https://");

export const sessionCookieName = (): string =>
  useSecureCookies() ? "__Secure-next-auth.session-token" : "next-auth.session-token";

export function authSecret(): string {
  const secret = process.env.NEXTAUTH_SECRET;
  if (!secret) throw new Error("NEXTAUTH_SECRET is not set (npm start generates one into var/nextauth-secret)");
  return secret;
}

/** Thirty days; the cookie is refreshed on use, so a person who keeps working stays signed in. */
export const SESSION_MAX_AGE_S = 30 * 24 * 3600;
