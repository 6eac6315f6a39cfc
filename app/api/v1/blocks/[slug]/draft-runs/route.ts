import { isBlockFileRequest, readBlockFile, readJson } from "@/lib/api/body";
import { noStore } from "@/lib/api/cache";
import { consumeEngine } from "@/lib/api/engine-limit";
import { pathParams, route } from "@/lib/api/handler";
import { requireUser } from "@/lib/blocks/common";
import { requestContext } from "@/lib/context";
import { startDraftRun } from "@/lib/runs/draft-runs";
import { slugParamsSchema } from "@/lib/validation/api";
import { draftRunBodySchema } from "@/lib/validation/blocks";

export const dynamic = "force-dynamic";

// The live preview's "simulate": JSON { params, version? } over a stored version, or an edited block file of this
// block. Answers 202 at once; the caller polls GET /api/v1/draft-runs/{id} and may DELETE it to cancel.
export const POST = route<{ slug: string }>(async (req, params) => {
  const { slug } = pathParams(slugParamsSchema, params);
  const ctx = await requestContext(req);
  requireUser(ctx.caller); // a draft run belongs to a person: signed out is 401 before anything is read
  const input = isBlockFileRequest(req) ? { text: await readBlockFile(req) } : draftRunBodySchema.parse(await readJson(req));
  await consumeEngine(ctx.caller, slug, "simulate");
  const run = await startDraftRun(ctx, { slug, ...input });
  return Response.json(run, { status: 202, headers: { ...noStore, Location: `/api/v1/draft-runs/${run.id}` } });
});
