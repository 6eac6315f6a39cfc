import { isBlockFileRequest, mediaType, readBlockFile, readJson } from "@/lib/api/body";
import { noStore } from "@/lib/api/cache";
import { created } from "@/lib/api/created";
import { pathParams, route } from "@/lib/api/handler";
import { pageOf } from "@/lib/api/pages";
import { listVersions } from "@/lib/blocks/read";
import { requestContext } from "@/lib/context";
import { addVersion, type NewVersionInput } from "@/lib/blocks/versions";
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
  let input: NewVersionInput;
  if (mediaType(req) === "application/json") {
    input = { slug, ...newVersionJsonSchema.parse(await readJson(req)) };
  } else if (isBlockFileRequest(req)) {
    const query = fileVersionQuerySchema.parse(queryObject(req.url));
    input = { slug, ...query, text: await readBlockFile(req) };
  } else {
    throw new AppError("unsupported_media_type", "send application/json, text/markdown or multipart/form-data");
  }
  return created(req, await addVersion(await requestContext(req), input));
});
