import { noStore } from "@/lib/api/cache";
import { pathParams, route } from "@/lib/api/handler";
import { requestContext } from "@/lib/context";
import { cancelDraftRun, getDraftRun } from "@/lib/runs/draft-runs";
import { draftRunIdInputSchema } from "@/lib/validation/runs";

export const dynamic = "force-dynamic";

/** A draft run of the caller's: poll until status is done, error or cancelled. */
export const GET = route<{ id: string }>(async (req, params) => {
  const input = pathParams(draftRunIdInputSchema, params);
  return Response.json(await getDraftRun(await requestContext(req), input), { headers: noStore });
});

/** Cancel: its simulations are stopped and no report is kept; answers once they have ended. */
export const DELETE = route<{ id: string }>(async (req, params) => {
  const input = pathParams(draftRunIdInputSchema, params);
  return Response.json(await cancelDraftRun(await requestContext(req), input), { headers: noStore });
});
