import { readJson } from "@/lib/api/body";
import { noStore } from "@/lib/api/cache";
import { engineCall } from "@/lib/api/engine-limit";
import { pathParams, route } from "@/lib/api/handler";
import { requestContext } from "@/lib/context";
import { retuneBlock } from "@/lib/runs/preview";
import { slugParamsSchema } from "@/lib/validation/api";
import { retuneBodySchema } from "@/lib/validation/blocks";

export const dynamic = "force-dynamic";

export const POST = route<{ slug: string }>(async (req, params) => {
  const { slug } = pathParams(slugParamsSchema, params);
  const body = retuneBodySchema.parse(await readJson(req));
  const ctx = await requestContext(req);
  const { value, snapped, report } = await engineCall(ctx.caller, slug, "retune", () => retuneBlock(ctx, { slug, ...body }));
  return Response.json({ value, snapped, report }, { headers: noStore });
});
