import { mediaType, readJson } from "@/lib/api/body";
import { created } from "@/lib/api/created";
import { pathParams, route } from "@/lib/api/handler";
import { forkBlock } from "@/lib/blocks/fork";
import { requestContext } from "@/lib/context";
import { slugParamsSchema } from "@/lib/validation/api";
import { forkBodySchema } from "@/lib/validation/blocks";

export const dynamic = "force-dynamic";

const hasBody = (req: Request) => req.headers.has("content-type") || Number(req.headers.get("content-length") ?? 0) > 0;

// The body is optional: a bare POST forks the head into the caller's team under a derived slug.
export const POST = route<{ slug: string }>(async (req, params) => {
  const { slug } = pathParams(slugParamsSchema, params);
  const body = hasBody(req) || mediaType(req) ? forkBodySchema.parse(await readJson(req)) : {};
  return created(req, await forkBlock(await requestContext(req), { ...body, source: slug }));
});
