import "server-only";
import { headers } from "next/headers";
import { redirect } from "next/navigation";
import type { Caller } from "./caller";
import { callerFromCookieHeader } from "./request-caller";

/** The caller of a page or server action, from the next-auth session cookie (anonymous when signed out). */
export async function getCaller(): Promise<Caller> {
  return callerFromCookieHeader((await headers()).get("cookie"));
}

/** A signed-in caller, or a redirect to the sign-in page that comes back here afterwards. */
export async function requireUser(backTo?: string): Promise<Caller & { user: NonNullable<Caller["user"]> }> {
  const caller = await getCaller();
  if (!caller.user) redirect(backTo ? `/sign-in?callbackUrl=${encodeURIComponent(backTo)}` : "/sign-in");
  return caller as Caller & { user: NonNullable<Caller["user"]> };
}
