import "server-only";
import { appUrl } from "@/lib/auth/config";
import { noStore } from "./cache";

export interface StoredResult {
  slug: string;
  version: number;
  run: { id: string; status: string };
}

/** 201 with the new version's URL in Location and { slug, version, run } in the body. */
export function created(req: Request, result: StoredResult): Response {
  // APP_URL, not the Host the request came in on: behind a proxy that is the address clients can reach.
  const location = new URL(`/api/v1/blocks/${result.slug}/versions/${result.version}`, appUrl() || req.url).toString();
  const body = { slug: result.slug, version: result.version, run: { id: result.run.id, status: result.run.status } };
  return Response.json(body, { status: 201, headers: { Location: location, ...noStore } });
}
