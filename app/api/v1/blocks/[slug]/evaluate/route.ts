import { isBlockFileRequest, readBlockFile, readJson } from "@/lib/api/body";
import { noStore } from "@/lib/api/cache";
import { engineCall } from "@/lib/api/engine-limit";
import { pathParams, route } from "@/lib/api/handler";
import { requestContext } from "@/lib/context";
import { evaluateBlock } from "@/lib/runs/preview";
import { queryObject, slugParamsSchema } from "@/lib/validation/api";
import { evaluateBodySchema, evaluateFileQuerySchema } from "@/lib/validation/blocks";

export const dynamic = "force-dynamic";

// JSON { params, simulate?, version? } against a stored version, or an edited block file of this block (CI).
export const POST = route<{ slug: string }>(async (req, params) => {
  const { slug } = pathParams(slugParamsSchema, params);
  const ctx = await requestContext(req);
  const input = isBlockFileRequest(req)
    ? { slug, text: await readBlockFile(req), simulate: evaluateFileQuerySchema.parse(queryObject(req.url)).simulate }
    : { slug, ...evaluateBodySchema.parse(await readJson(req)) };
  const report = await engineCall(ctx.caller, slug, input.simulate === true ? "simulate" : "evaluate", () => evaluateBlock(ctx, input));
  return Response.json(report, { headers: noStore });
});
