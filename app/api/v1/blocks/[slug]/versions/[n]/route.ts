import { blockResponse } from "@/lib/api/block-response";
import { pathParams, route } from "@/lib/api/handler";
import { queryObject, versionParamsSchema } from "@/lib/validation/api";
import { formatQuerySchema } from "@/lib/validation/blocks";
import { requestContext } from "@/lib/context";

export const dynamic = "force-dynamic";

export const GET = route<{ slug: string; n: string }>(async (req, params) => {
  const { slug, n } = pathParams(versionParamsSchema, params);
  const { format } = formatQuerySchema.parse(queryObject(req.url));
  return blockResponse(req, await requestContext(req), slug, n, format);
});
