import { badgeHeaders } from "@/lib/api/cache";
import { pathParams, route } from "@/lib/api/handler";
import { hallmarkSvg } from "@/lib/badges/hallmark-svg";
import { getBlock } from "@/lib/blocks/read";
import { queryObject, slugParamsSchema } from "@/lib/validation/api";
import { badgeQuerySchema } from "@/lib/validation/blocks";
import { requestContext } from "@/lib/context";

export const dynamic = "force-dynamic";

// Anonymous callers get public blocks; a team block answers 404 outside the team (getBlock decides).
export const GET = route<{ slug: string }>(async (req, params) => {
  const { slug } = pathParams(slugParamsSchema, params);
  const { version } = badgeQuerySchema.parse(queryObject(req.url));
  const view = await getBlock(await requestContext(req), { slug, version });
  const svg = hallmarkSvg({ badge: view.badge, version: view.version, approved: view.approved });
  return new Response(svg, {
    headers: {
      "Content-Type": "image/svg+xml; charset=utf-8",
      "Content-Security-Policy": "default-src 'none'; style-src 'unsafe-inline'",
      "X-Content-Type-Options": "nosniff",
      ...badgeHeaders(view.visibility),
    },
  });
});
