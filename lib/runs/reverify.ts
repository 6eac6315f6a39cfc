import type { EntityManager } from "@mikro-orm/postgresql";
import { BlockVersionSchema } from "@/entities";
import { badgesFor, currentStamp } from "./badge";
import { enqueueRun } from "./enqueue";

/**
 * Queues a run for every head whose badge is stale (made with another engine or model library) or that
 * has never had a run. An advisory lock makes two workers starting together queue each head once.
 */
export async function enqueueStaleHeads(em: EntityManager, opts: { teamIds?: number[] } = {}): Promise<{ queued: number; slugs: string[] }> {
  const stamp = currentStamp();
  return em.transactional(async (tx) => {
    const ctx = tx.getTransactionContext();
    const conn = tx.getConnection();
    await conn.execute(`select pg_advisory_xact_lock(hashtext('assay-reverify'))`, [], "all", ctx);
    const teamFilter = opts.teamIds?.length ? `and team_id in (${opts.teamIds.map(() => "?").join(",")})` : "";
    const heads = await conn.execute<{ head_id: number; slug: string }[]>(
      `select head_id, slug from blocks where archived = false and head_id is not null ${teamFilter}`,
      opts.teamIds ?? [], "all", ctx);
    const badges = await badgesFor(tx, heads.map((h) => h.head_id), stamp);
    const slugs: string[] = [];
    for (const h of heads) {
      const b = badges.get(h.head_id)!;
      if (b.badge === "stale" || !b.run) {
        await enqueueRun(tx, tx.getReference(BlockVersionSchema, h.head_id), "reverify");
        slugs.push(h.slug);
      }
    }
    await tx.flush();
    return { queued: slugs.length, slugs };
  });
}
