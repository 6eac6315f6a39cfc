import type { EntityManager } from "@mikro-orm/postgresql";
import { anonymous, type Caller } from "@/lib/auth/caller";
import { callerFromRequest } from "@/lib/auth/request-caller";
import { getEm } from "@/lib/db/orm";

/**
 * What every service entry takes first: one EntityManager for this request, job or script (its identity map is
 * the unit of work) and who is asking. Made once at the edge, never inside a service.
 */
export interface Ctx {
  em: EntityManager;
  caller: Caller;
}

/** A context for a caller already known (worker jobs, CLIs, seeds, tests): one fresh fork. */
export async function contextFor(caller: Caller = anonymous, em?: EntityManager): Promise<Ctx> {
  return { em: em ?? (await getEm()), caller };
}

/**
 * A route handler's context: one fork, and the caller from the Bearer token or the session cookie. The caller is
 * resolved once per request: the route wrapper has already asked for it (to answer 401 first), so it is reused.
 */
export async function requestContext(req: Request): Promise<Ctx> {
  const [em, caller] = await Promise.all([getEm(), callerFromRequest(req)]);
  return { em, caller };
}

/** The same context with another caller, e.g. a job acting for the person who queued it. */
export const asCaller = (ctx: Ctx, caller: Caller): Ctx => ({ em: ctx.em, caller });
