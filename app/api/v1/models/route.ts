import { noStore } from "@/lib/api/cache";
import { route } from "@/lib/api/handler";
import { requestContext } from "@/lib/context";
import { listModels } from "@/lib/models/read";
import { parseFor } from "@/lib/models/common";
import { queryObject } from "@/lib/validation/api";
import { modelListQuerySchema } from "@/lib/validation/models";

export const dynamic = "force-dynamic";

export const GET = route(async (req) => {
  const ctx = await requestContext(req);
  const query = parseFor(ctx, () => modelListQuerySchema.parse(queryObject(req.url)));
  // A token's own team is the default (DESIGN.md "REST API v1").
  const team = query.team ?? (ctx.caller.token ? ctx.caller.memberships.find((m) => m.teamId === ctx.caller.token!.teamId)?.teamSlug : undefined);
  const list = await listModels(ctx, { team });
  return Response.json(list, { headers: { ...noStore, Vary: "Authorization, Cookie" } });
});
