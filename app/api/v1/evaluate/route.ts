import { readBlockFile } from "@/lib/api/body";
import { noStore } from "@/lib/api/cache";
import { engineCall } from "@/lib/api/engine-limit";
import { route } from "@/lib/api/handler";
import { teamForEvaluation } from "@/lib/blocks/team-default";
import { requestContext } from "@/lib/context";
import { evaluateFile } from "@/lib/runs/preview";
import { queryObject } from "@/lib/validation/api";
import { evaluateFileQuerySchema } from "@/lib/validation/blocks";

export const dynamic = "force-dynamic";

// A block file not in the library yet (CI checks it before it is pushed): a report, nothing stored.
export const POST = route(async (req) => {
  const ctx = await requestContext(req);
  const query = evaluateFileQuerySchema.parse(queryObject(req.url));
  const team = teamForEvaluation(ctx.caller, query.team);
  const text = await readBlockFile(req);
  const report = await engineCall(ctx.caller, `new:${team.slug}`, query.simulate ? "simulate" : "evaluate", () =>
    evaluateFile(ctx, { text, simulate: query.simulate, teamId: team.id }));
  return Response.json(report, { headers: noStore });
});
