import os from "node:os";
import type { EntityManager } from "@mikro-orm/postgresql";

/** One row per worker process, refreshed every few seconds; the health probe reads the newest. */
export async function beat(em: EntityManager, workerId: string, runId: string | null, startedAt: Date): Promise<void> {
  await em.getConnection().execute(
    `insert into worker_heartbeats (id, host, pid, run_id, started_at, seen_at) values (?, ?, ?, ?, ?, now())
     on conflict (id) do update set seen_at = now(), run_id = excluded.run_id`,
    [workerId, os.hostname().slice(0, 200), process.pid, runId, startedAt]);
}

export async function forget(em: EntityManager, workerId: string): Promise<void> {
  await em.getConnection().execute(`delete from worker_heartbeats where id = ?`, [workerId]);
}

/** Rows of workers that died without saying goodbye, once they have been silent for a day. */
export async function pruneSilent(em: EntityManager): Promise<void> {
  await em.getConnection().execute(`delete from worker_heartbeats where seen_at < now() - interval '1 day'`);
}
