import { noStore } from "@/lib/api/cache";
import { pathParams, route } from "@/lib/api/handler";
import { callerFromRequest } from "@/lib/auth/request-caller";
import { getRun } from "@/lib/runs/runs";
import { runParamsSchema } from "@/lib/validation/api";

export const dynamic = "force-dynamic";

const iso = (d: Date | string | null) => (d == null ? null : new Date(d).toISOString());

export const GET = route<{ id: string }>(async (req, params) => {
  const { id } = pathParams(runParamsSchema, params);
  const caller = await callerFromRequest(req);
  const run = await getRun(caller, id);
  return Response.json(
    {
      id: run.id,
      slug: run.slug,
      version: run.version,
      status: run.status,
      badge: run.badge,
      report: run.report,
      durationMs: run.durationMs,
      progress: run.progress,
      error: run.error,
      models: run.models,
      createdAt: iso(run.createdAt),
      finishedAt: iso(run.finishedAt),
    },
    { headers: noStore },
  );
});
