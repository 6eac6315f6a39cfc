import { readModelFile } from "@/lib/api/model-body";
import { noStore } from "@/lib/api/cache";
import { pathParams, route } from "@/lib/api/handler";
import { appUrl } from "@/lib/auth/config";
import { requestContext } from "@/lib/context";
import { AppError } from "@/lib/errors";
import { mayUpload, uploadModel } from "@/lib/models/upload";
import { queryObject } from "@/lib/validation/api";
import { libraryParamsSchema, uploadQuerySchema } from "@/lib/validation/models";

export const dynamic = "force-dynamic";

export const POST = route<{ team: string }>(async (req, params) => {
  const ctx = await requestContext(req);
  if (!ctx.caller.user) throw new AppError("unauthenticated", "sign in first");
  const { team } = pathParams(libraryParamsSchema, params);
  // Who may upload is settled before the body is read: 401, 404 and 403 come before 415 and 422.
  await mayUpload(ctx, team);
  const query = uploadQuerySchema.parse(queryObject(req.url));
  const file = await readModelFile(req, query.name);
  const result = await uploadModel(ctx, { team, name: file.name, text: file.text, message: query.message });
  const location = new URL(`/api/v1/models/${result.team}/${result.name}?version=${result.version}`, appUrl() || req.url).toString();
  return Response.json(result, { status: 201, headers: { Location: location, ...noStore } });
});
