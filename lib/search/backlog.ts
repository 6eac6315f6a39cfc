import type { EntityManager } from "@mikro-orm/postgresql";
import { OutboxEventSchema } from "@/entities";

/** Events the search index has not yet applied. */
export async function indexBacklog(em: EntityManager): Promise<number> {
  return em.count(OutboxEventSchema, { indexedAt: null });
}
