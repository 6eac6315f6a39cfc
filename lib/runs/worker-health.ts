import { getEm } from "@/lib/db/orm";

/** Seconds after which a silent worker counts as gone (it beats every 5 s). */
const SILENT_AFTER_S = 30;

/** "ok" while some worker beat within the last 30 s; otherwise a sentence the health route shows. */
export async function workerHealth(): Promise<string> {
  const em = await getEm();
  const [row] = await em.getConnection().execute<{ n: string; last: Date | null; age: number | null; queued: string }[]>(
    `select (select count(*) from worker_heartbeats where seen_at > now() - make_interval(secs => ?)) as n,
            (select max(seen_at) from worker_heartbeats) as last,
            (select extract(epoch from now() - max(seen_at)) from worker_heartbeats) as age,
            (select count(*) from check_runs where status = 'queued') as queued`, [SILENT_AFTER_S]);
  if (Number(row.n) > 0) return "ok";
  if (!row.last) return `no worker has started (${row.queued} runs queued)`;
  return `no worker heartbeat for ${Math.round(Number(row.age))} s (${row.queued} runs queued)`;
}
