import type { EntityManager } from "@mikro-orm/postgresql";
import { OutboxEventSchema, type OutboxEvent, type OutboxKind } from "@/entities";

/**
 * Records an event in the caller's unit of work, so it commits or rolls back with the change itself.
 * Consumers (search indexer: `indexedAt`, mailer: `notifiedAt`) poll unprocessed rows with `takeEvents`.
 */
export function writeEvent(em: EntityManager, kind: OutboxKind, payload: Record<string, unknown>): OutboxEvent {
  return em.create(OutboxEventSchema, { kind, payload, indexedAt: null, notifiedAt: null, createdAt: new Date() });
}

export type OutboxConsumer = "indexedAt" | "notifiedAt";
const column: Record<OutboxConsumer, string> = { indexedAt: "indexed_at", notifiedAt: "notified_at" };

export interface PendingEvent {
  id: number;
  kind: OutboxKind;
  payload: Record<string, unknown>;
  createdAt: Date;
}

/**
 * Hands a batch of unprocessed events to `handle` and marks them done in one transaction.
 * Rows are locked with SKIP LOCKED, so two consumers of the same kind never get the same event;
 * if `handle` throws, nothing is marked and the batch comes back on the next poll.
 */
export async function takeEvents(
  em: EntityManager,
  consumer: OutboxConsumer,
  handle: (events: PendingEvent[]) => Promise<void>,
  limit = 50,
): Promise<number> {
  const col = column[consumer];
  return em.transactional(async (tx) => {
    const conn = tx.getConnection();
    const ctx = tx.getTransactionContext();
    const rows = await conn.execute<{ id: number; kind: OutboxKind; payload: Record<string, unknown>; created_at: Date }[]>(
      `select id, kind, payload, created_at from outbox_events where ${col} is null order by id limit ? for update skip locked`,
      [limit], "all", ctx,
    );
    if (rows.length === 0) return 0;
    await handle(rows.map((r) => ({ id: r.id, kind: r.kind, payload: r.payload, createdAt: r.created_at })));
    await conn.execute(`update outbox_events set ${col} = now() where id in (${rows.map(() => "?").join(",")})`,
      rows.map((r) => r.id), "run", ctx);
    return rows.length;
  });
}

/** Events a consumer has not processed yet (the health route's index backlog). */
export async function backlog(em: EntityManager, consumer: OutboxConsumer): Promise<number> {
  const [row] = await em.getConnection().execute<{ n: string }[]>(
    `select count(*) as n from outbox_events where ${column[consumer]} is null`);
  return Number(row.n);
}
