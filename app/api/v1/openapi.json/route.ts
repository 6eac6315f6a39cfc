import { route } from "@/lib/api/handler";
import { openApiDocument } from "@/lib/openapi/document";

export const dynamic = "force-static";

export const GET = route(async () => Response.json(openApiDocument(), { headers: { "Cache-Control": "public, max-age=300" } }));
