import { immutableHeaders, revalidateHeaders } from "@/lib/api/cache";
import { conditional } from "@/lib/api/etag";
import { pathParams, route } from "@/lib/api/handler";
import { requestContext } from "@/lib/context";
import { getModel, getModelVersion } from "@/lib/models/read";
import { parseFor, SHARED } from "@/lib/models/common";
import { queryObject } from "@/lib/validation/api";
import { modelParamsSchema, modelQuerySchema } from "@/lib/validation/models";

export const dynamic = "force-dynamic";

// A numbered version is immutable: a year's cache and a validator that is its content. The head (no version) carries
// its versions and the badges of the blocks that use it, so clients revalidate it against a hash of the body.
export const GET = route<{ team: string; name: string }>(async (req, params) => {
  const ctx = await requestContext(req);
  const { team, name } = pathParams(modelParamsSchema, params);
  const { version } = parseFor(ctx, () => modelQuerySchema.parse(queryObject(req.url)));
  const visibility = team === SHARED ? "public" : "team";
  if (version !== undefined) {
    return conditional(req, JSON.stringify(await getModelVersion(ctx, { team, name, version })), {
      "Content-Type": "application/json", ...immutableHeaders(visibility),
    });
  }
  return conditional(req, JSON.stringify(await getModel(ctx, { team, name })), { "Content-Type": "application/json", ...revalidateHeaders(visibility) });
});
