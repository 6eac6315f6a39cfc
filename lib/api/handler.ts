import "server-only";
import { ZodError, type ZodType, type z } from "zod";
import { callerFromRequest } from "@/lib/auth/request-caller";
import { AppError } from "@/lib/errors";
import { RETRY_AFTER_S, outageOf } from "./outage";
import { problem } from "./problem";
import { refuseCrossSiteCookieWrite } from "./same-origin";

// What a request's shape can be wrong in: a signed-out caller is told to sign in instead (DESIGN.md, REST API).
const SHAPE_ERRORS = new Set(["validation", "payload_too_large", "unsupported_media_type"]);
const isShapeError = (err: unknown) => err instanceof ZodError || (err instanceof AppError && SHAPE_ERRORS.has(err.code));

export interface RouteContext<P> {
  params: Promise<P>;
}

/**
 * Wraps a route handler. The caller is resolved first: a bad token is a 401 before anything is read, and a
 * signed-out request whose body, query or type does not validate is a 401 too, never a 413/415/422.
 * AppError and ZodError become problem documents; a database or search outage is a 503 with Retry-After;
 * anything else is logged with the request line and answered with a bare 500, so causes never reach the client.
 */
export function route<P = Record<string, never>>(fn: (req: Request, params: P) => Promise<Response>) {
  return async (req: Request, ctx: RouteContext<P>): Promise<Response> => {
    let signedOut = false;
    try {
      refuseCrossSiteCookieWrite(req);
      signedOut = !(await callerFromRequest(req)).user;
      return await fn(req, ((await ctx?.params) ?? {}) as P);
    } catch (err) {
      if (signedOut && isShapeError(err)) {
        return problem(new AppError("unauthenticated", "sign in or send a valid API token; requests from signed-out callers are not validated"));
      }
      const outage = outageOf(err);
      if (outage) {
        console.error(`[api] ${req.method} ${new URL(req.url).pathname}: the ${outage} is unavailable`, (err as Error).message);
        return problem(new AppError("unavailable", `the ${outage} is unavailable right now; try again shortly`, { retryAfter: RETRY_AFTER_S }));
      }
      if (!(err instanceof AppError) && !(err instanceof ZodError)) {
        console.error(`[api] ${req.method} ${new URL(req.url).pathname} failed`, err);
        return problem(new Error("internal"));
      }
      return problem(err);
    }
  };
}

/** Path parameters that fail their schema cannot name anything: 404 like a missing resource. */
export function pathParams<S extends ZodType>(schema: S, params: unknown): z.infer<S> {
  const r = schema.safeParse(params);
  if (!r.success) throw new AppError("not_found", "no such resource");
  return r.data;
}
