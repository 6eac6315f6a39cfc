import "server-only";
import { ZodError, type ZodType, type z } from "zod";
import { AppError } from "@/lib/errors";
import { problem } from "./problem";
import { refuseCrossSiteCookieWrite } from "./same-origin";

export interface RouteContext<P> {
  params: Promise<P>;
}

/**
 * Wraps a route handler: AppError and ZodError become problem documents, anything else is logged with the
 * request line and answered with a bare 500 so database and engine causes never reach the client.
 */
export function route<P = Record<string, never>>(fn: (req: Request, params: P) => Promise<Response>) {
  return async (req: Request, ctx: RouteContext<P>): Promise<Response> => {
    try {
      refuseCrossSiteCookieWrite(req);
      return await fn(req, ((await ctx?.params) ?? {}) as P);
    } catch (err) {
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
