import { readJson } from "@/lib/api/body";
import { noStore } from "@/lib/api/cache";
import { consumeEngine } from "@/lib/api/engine-limit";
import { pathParams, route } from "@/lib/api/handler";
import { callerFromRequest } from "@/lib/auth/request-caller";
import { evaluateBlock } from "@/lib/runs/preview";
import { slugParamsSchema } from "@/lib/validation/api";
import { evaluateBodySchema } from "@/lib/validation/blocks";

export const dynamic = "force-dynamic";

export const POST = route<{ slug: string }>(async (req, params) => {
  const { slug } = pathParams(slugParamsSchema, params);
  const body = evaluateBodySchema.parse(await readJson(req));
  const caller = await callerFromRequest(req);
  await consumeEngine(caller, slug, body.simulate === true ? "simulate" : "evaluate");
  return Response.json(await evaluateBlock(caller, slug, body), { headers: noStore });
});
