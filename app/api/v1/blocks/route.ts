import { readBlockFile } from "@/lib/api/body";
import { noStore } from "@/lib/api/cache";
import { created } from "@/lib/api/created";
import { route } from "@/lib/api/handler";
import { createBlock } from "@/lib/blocks/create";
import { requestContext } from "@/lib/context";
import { searchBlocks } from "@/lib/search/search";
import { queryObject } from "@/lib/validation/api";
import { createQuerySchema, searchQuerySchema } from "@/lib/validation/blocks";

export const dynamic = "force-dynamic";

export const GET = route(async (req) => {
  const query = searchQuerySchema.parse(queryObject(req.url));
  const { items, nextCursor, estimatedTotal, facets } = await searchBlocks(await requestContext(req), query);
  return Response.json({ items, nextCursor, estimatedTotal, facets }, { headers: { ...noStore, Vary: "Authorization, Cookie" } });
});

export const POST = route(async (req) => {
  const query = createQuerySchema.parse(queryObject(req.url));
  const text = await readBlockFile(req);
  return created(req, await createBlock(await requestContext(req), { ...query, text }));
});
