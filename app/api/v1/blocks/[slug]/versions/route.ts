import { isBlockFileRequest, mediaType, readBlockFile, readJson } from "@/lib/api/body";
import { noStore } from "@/lib/api/cache";
import { created } from "@/lib/api/created";
import { pathParams, route } from "@/lib/api/handler";
import { pageOf } from "@/lib/api/pages";
import { callerFromRequest } from "@/lib/auth/request-caller";
import { listVersions } from "@/lib/blocks/read";
import { requestContext } from "@/lib/context";
import { addVersion } from "@/lib/blocks/versions";
import { AppError } from "@/lib/errors";
import { cursorQuerySchema, queryObject, slugParamsSchema } from "@/lib/validation/api";
import { fileVersionQuerySchema, newVersionJsonSchema } from "@/lib/validation/blocks";

export const dynamic = "force-dynamic";

export const GET = route<{ slug: string }>(async (req, params) => {
  const { slug } = pathParams(slugParamsSchema, params);
  const { cursor, limit } = cursorQuerySchema.parse(queryObject(req.url));
  const rows = await listVersions(await requestContext(req), { slug });
  const page = pageOf(rows, cursor, limit);
  const items = page.items.map(({ version, badge, approved, author, message, createdAt }) => ({ version, badge, approved, author, message, createdAt }));
  return Response.json({ items, nextCursor: page.nextCursor }, { headers: { ...noStore, Vary: "Authorization, Cookie" } });
});

// Two ways to make a version: new values as JSON against a base, or a whole file with ?baseVersion=n.
export const POST = route<{ slug: string }>(async (req, params) => {
  const { slug } = pathParams(slugParamsSchema, params);
  let input: { text?: string; params?: Record<string, string>; baseVersion: number; message?: string };
  if (mediaType(req) === "application/json") {
    input = newVersionJsonSchema.parse(await readJson(req));
  } else if (isBlockFileRequest(req)) {
    const query = fileVersionQuerySchema.parse(queryObject(req.url));
    input = { text: await readBlockFile(req), baseVersion: query.baseVersion, message: query.message };
  } else {
    throw new AppError("unsupported_media_type", "send application/json, text/markdown or multipart/form-data");
  }
  const caller = await callerFromRequest(req);
  return created(req, await addVersion(caller, slug, input));
});
