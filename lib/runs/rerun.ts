import "server-only";
import { BlockVersionSchema, CheckRunSchema } from "@/entities";
import type { Ctx } from "@/lib/context";
import { loadBlock, loadVersion } from "@/lib/blocks/common";
import { AppError } from "@/lib/errors";
import { enqueueRun } from "./enqueue";

/**
 * A maintainer asks for a version's checks to run again (a flaky host, a doubt about a cached result).
 * One open run per version: a second request while one is queued or running is refused, not queued twice.
 */
export async function rerunVersion(ctx: Ctx, input: { slug: string; version: number }): Promise<{ id: string; status: "queued" }> {
  const block = await loadBlock(ctx.em, ctx.caller, input.slug, "version.approve");
  const version = await loadVersion(ctx.em, block, input.version);
  return ctx.em.transactional(async (tx) => {
    const open = await tx.count(CheckRunSchema, { version: version.id, status: { $in: ["queued", "running"] } });
    if (open > 0) throw new AppError("conflict", `v${version.number} already has a run waiting or in progress`);
    const run = await enqueueRun(tx, tx.getReference(BlockVersionSchema, version.id), "manual");
    return { id: run.id, status: "queued" as const };
  });
}
