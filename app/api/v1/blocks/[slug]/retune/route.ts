import { readJson } from "@/lib/api/body";
import { noStore } from "@/lib/api/cache";
import { engineCall } from "@/lib/api/engine-limit";
import { pathParams, route } from "@/lib/api/handler";
import { callerFromRequest } from "@/lib/auth/request-caller";
import { retuneBlock } from "@/lib/runs/preview";
import { slugParamsSchema } from "@/lib/validation/api";
import { retuneBodySchema } from "@/lib/validation/blocks";

export const dynamic = "force-dynamic";

export const POST = route<{ slug: string }>(async (req, params) => {
  const { slug } = pathParams(slugParamsSchema, params);
  const body = retuneBodySchema.parse(await readJson(req));
  const caller = await callerFromRequest(req);
  const { value, snapped, report } = await engineCall(caller, slug, "retune", () => retuneBlock(caller, slug, body));
  return Response.json({ value, snapped, report }, { headers: noStore });
});
