import { blockResponse } from "@/lib/api/block-response";
import { pathParams, route } from "@/lib/api/handler";
import { callerFromRequest } from "@/lib/auth/request-caller";
import { queryObject, versionParamsSchema } from "@/lib/validation/api";
import { formatQuerySchema } from "@/lib/validation/blocks";

export const dynamic = "force-dynamic";

export const GET = route<{ slug: string; n: string }>(async (req, params) => {
  const { slug, n } = pathParams(versionParamsSchema, params);
  const { format } = formatQuerySchema.parse(queryObject(req.url));
  const caller = await callerFromRequest(req);
  return blockResponse(req, caller, slug, n, format);
});
