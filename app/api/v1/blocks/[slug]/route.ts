import { blockResponse } from "@/lib/api/block-response";
import { pathParams, route } from "@/lib/api/handler";
import { queryObject, slugParamsSchema } from "@/lib/validation/api";
import { formatQuerySchema } from "@/lib/validation/blocks";
import { requestContext } from "@/lib/context";

export const dynamic = "force-dynamic";

export const GET = route<{ slug: string }>(async (req, params) => {
  const { slug } = pathParams(slugParamsSchema, params);
  const { format } = formatQuerySchema.parse(queryObject(req.url));
  return blockResponse(req, await requestContext(req), slug, undefined, format);
});
