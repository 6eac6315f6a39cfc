import { noStore } from "@/lib/api/cache";
import { pathParams, route } from "@/lib/api/handler";
import { requestContext } from "@/lib/context";
import { getRun } from "@/lib/runs/runs";
import { runParamsSchema } from "@/lib/validation/api";

export const dynamic = "force-dynamic";

const iso = (d: Date | string | null) => (d == null ? null : new Date(d).toISOString());

export const GET = route<{ id: string }>(async (req, params) => {
  const input = pathParams(runParamsSchema, params);
  const run = await getRun(await requestContext(req), input);
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
