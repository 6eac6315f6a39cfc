import type { EntityManager } from "@mikro-orm/postgresql";
import { BlockSchema, OutboxEventSchema } from "@/entities";
import { blocksIndex } from "./client";
import { blockDocuments } from "./document";
import { ensureBlocksIndex } from "./settings";

/**
 * Apply pending outbox events to the index. Each event only names a block; the document is rebuilt from
 * PostgreSQL, so replays and out-of-order events converge on the current state. If the search server is down
 * this throws and the events stay pending for the next pass.
 */
export async function processIndexBacklog(em: EntityManager, limit = 200): Promise<number> {
  const events = await em.find(OutboxEventSchema, { indexedAt: null }, { orderBy: { id: "asc" }, limit });
  if (!events.length) return 0;
  await ensureBlocksIndex();
  const slugs = [...new Set(events.map((e) => e.payload.slug).filter((s): s is string => typeof s === "string"))];
  const blocks = await em.find(BlockSchema, { slug: { $in: slugs } }, { populate: ["head", "team"] });
  const { docs: upserts, removals } = await blockDocuments(em, blocks);
  const index = blocksIndex();
  if (upserts.length) await index.addDocuments(upserts).waitTask({ timeout: 30_000 });
  if (removals.length) await index.deleteDocuments(removals).waitTask({ timeout: 30_000 });
  const now = new Date();
  for (const e of events) e.indexedAt = now;
  await em.flush();
  return events.length;
}

/** Rebuild the whole index from PostgreSQL (npm run reindex). */
export async function reindexAll(em: EntityManager): Promise<number> {
  await ensureBlocksIndex();
  const index = blocksIndex();
  await index.deleteAllDocuments().waitTask({ timeout: 60_000 });
  const blocks = await em.find(BlockSchema, { archived: false }, { populate: ["head", "team"] });
  const { docs } = await blockDocuments(em, blocks);
  for (let i = 0; i < docs.length; i += 500) {
    await index.addDocuments(docs.slice(i, i + 500)).waitTask({ timeout: 60_000 });
  }
  await em.nativeUpdate(OutboxEventSchema, { indexedAt: null }, { indexedAt: new Date() });
  return docs.length;
}
