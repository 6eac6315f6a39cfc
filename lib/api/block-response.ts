import "server-only";
import type { Ctx } from "@/lib/context";
import { spiceDeckText } from "@/lib/blocks/deck";
import { getBlock, getBlockWithLineage } from "@/lib/blocks/read";
import { toBlockJson } from "./block-json";
import { immutableHeaders, revalidateHeaders } from "./cache";
import { conditional, conditionalBuilt } from "./etag";

export type BlockFormat = "json" | "md" | "spice";

/**
 * GET of a head (version undefined) or of one version, in one of three representations, with a strong ETag
 * and If-None-Match → 304. See lib/api/cache.ts for the cache policy.
 */
export async function blockResponse(req: Request, ctx: Ctx, slug: string, version: number | undefined, format: BlockFormat) {
  if (format === "json") {
    // One load gives block and lineage; the validator comes from what determines the body, so a 304 builds no JSON.
    const read = await getBlockWithLineage(ctx, { slug, version });
    return conditionalBuilt(req, read.etag, async () => JSON.stringify(toBlockJson(await read.view(), read.lineage)), {
      "Content-Type": "application/json",
      ...revalidateHeaders(read.visibility),
    });
  }
  const view = await getBlock(ctx, { slug, version });
  const fixed = version !== undefined;
  const name = `${view.slug}-v${view.version}`;
  const cache = fixed ? immutableHeaders(view.visibility) : revalidateHeaders(view.visibility);
  if (format === "md") {
    return conditional(req, view.text, {
      "Content-Type": "text/markdown; charset=utf-8",
      "Content-Disposition": `inline; filename="${name}.md"`,
      ...cache,
    });
  }
  // The deck inlines the model versions and analyses of the latest run, which a reverify changes: revalidate it.
  return conditional(req, await spiceDeckText(ctx, { slug, version }), {
    "Content-Type": "text/plain; charset=utf-8",
    "Content-Disposition": `attachment; filename="${name}.cir"`,
    ...revalidateHeaders(view.visibility),
  });
}
