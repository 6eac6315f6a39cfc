import "server-only";
import { cookies } from "next/headers";
import { redirect } from "next/navigation";
import type { Caller } from "./caller";
import { pageContext } from "@/lib/next-context";
import { sessionCookieFor } from "./session-token";

/** The caller of a page or server action, from the next-auth session cookie (anonymous when signed out). */
export async function getCaller(): Promise<Caller> {
  return (await pageContext()).caller;
}

/** A signed-in caller, or a redirect to the sign-in page that comes back here afterwards. */
export async function requireUser(backTo?: string): Promise<Caller & { user: NonNullable<Caller["user"]> }> {
  const caller = await getCaller();
  if (!caller.user) redirect(backTo ? `/sign-in?callbackUrl=${encodeURIComponent(backTo)}` : "/sign-in");
  return caller as Caller & { user: NonNullable<Caller["user"]> };
}

/**
 * Replaces this browser's session cookie with one signed in at `at` (after a password change ended the older
 * sessions), and drops the chunks next-auth writes for an oversized token, so no stale half is left behind.
 */
export async function restartSession(user: { id: number; email: string; name: string }, at: Date): Promise<void> {
  const jar = await cookies();
  const { name, value, options } = await sessionCookieFor(user, at);
  for (const c of jar.getAll()) if (c.name.startsWith(`${name}.`)) jar.delete(c.name);
  jar.set(name, value, options);
}
