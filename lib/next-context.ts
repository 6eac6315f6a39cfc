import "server-only";
import { headers } from "next/headers";
import { cache } from "react";
import { callerFromCookieWith } from "@/lib/auth/request-caller";
import { getEm } from "@/lib/db/orm";
import type { Ctx } from "@/lib/context";

/**
 * A page's or server action's context: one fork and the session caller, made once per request. React's `cache`
 * shares it between generateMetadata, the page and the server components it renders.
 */
export const pageContext = cache(async (): Promise<Ctx> => {
  // The request's headers first: while `next build` prerenders, they mark the page as rendered per request before
  // anything asks for the database (a page with no loading boundary above it would otherwise fail the build).
  const cookie = (await headers()).get("cookie");
  const em = await getEm();
  return { em, caller: await callerFromCookieWith(em, cookie) };
});

/** Server actions run once per request; the same shape as a page's, made fresh so no render's em is reused. */
export async function actionContext(): Promise<Ctx> {
  const em = await getEm();
  return { em, caller: await callerFromCookieWith(em, (await headers()).get("cookie")) };
}
