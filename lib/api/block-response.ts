import { spiceDeck } from "@/checks";
import type { Caller } from "@/lib/auth/caller";
import { getBlock, getLineage } from "@/lib/blocks/read";
import { toBlockJson } from "./block-json";
import { immutableHeaders, revalidateHeaders } from "./cache";
import { conditional } from "./etag";

export type BlockFormat = "json" | "md" | "spice";

/**
 * GET of a head (version undefined) or of one version, in one of three representations, with a strong ETag
 * and If-None-Match → 304. See lib/api/cache.ts for the cache policy.
 */
export async function blockResponse(req: Request, caller: Caller, slug: string, version: number | undefined, format: BlockFormat) {
  // Lineage only goes into the JSON; fetched beside the block rather than after it (each is a few queries).
  const lineageP = format === "json" ? getLineage(caller, slug) : null;
  lineageP?.catch(() => {});
  const view = await getBlock(caller, slug, version);
  const fixed = version !== undefined;
  const name = `${view.slug}-v${view.version}`;
  if (format === "md") {
    return conditional(req, view.text, {
      "Content-Type": "text/markdown; charset=utf-8",
      "Content-Disposition": `inline; filename="${name}.md"`,
      ...(fixed ? immutableHeaders(view.visibility) : revalidateHeaders(view.visibility)),
    });
  }
  if (format === "spice") {
    return conditional(req, spiceDeck(view.text), {
      "Content-Type": "text/plain; charset=utf-8",
      "Content-Disposition": `attachment; filename="${name}.cir"`,
      ...(fixed ? immutableHeaders(view.visibility) : revalidateHeaders(view.visibility)),
    });
  }
  const lineage = await lineageP!;
  return conditional(req, JSON.stringify(toBlockJson(view, lineage)), {
    "Content-Type": "application/json",
    ...revalidateHeaders(view.visibility),
  });
}
