import type PgBoss from "pg-boss";
import { defaultCacheDir, defaultConcurrency, holdsCached, localExecutor, seesCache, writeCached, type SimExecutor, type SimOutcome } from "@/checks";
import { getEm } from "@/lib/db/orm";
import { beforeBossStops, inTransaction, SIMULATE_QUEUE, startedBoss } from "@/lib/queue/boss";
import { SIM_CHANNEL, type SimJobData } from "./sim-jobs";

/** Simulations one worker process runs at once: one per core by default (ngspice uses one), like the engine's own. */
export const SIM_SLOTS = Math.max(1, Number(process.env.ASSAY_SIM_CONCURRENCY ?? defaultConcurrency()));
/**
 * Jobs one slot takes at most at a time. The engine runs short simulations of one call in one ngspice process, so
 * the process start-up (a quarter of a short transient) is paid once per group. Groups form only while the queue is
 * deep (a quarter of a round of every slot each at most), so a run of a few simulations still spreads over every worker.
 */
export const SIM_GROUP = Math.max(1, Number(process.env.ASSAY_SIM_GROUP ?? 4));
const groupSize = (waiting: number) => Math.max(1, Math.min(SIM_GROUP, Math.floor(waiting / (4 * SIM_SLOTS))));

type Loop = { wake: () => void; stop: () => Promise<void> };
let current: Loop | null = null;

/** The process's simulate loop, started on first use; it stops with the queue client (stopBoss, closeOrm). */
export function simulating(workerId: string, log: (line: string) => void = (l) => console.log(`[worker ${workerId}] ${l}`)): Loop {
  if (current) return current;
  const loop = startSimulating(workerId, log);
  current = loop;
  beforeBossStops(async () => {
    if (current === loop) current = null;
    await loop.stop();
  });
  return loop;
}

/**
 * The worker's second loop: takes `simulate` jobs of any run (its own verification's or another worker's) as
 * slots free up, runs each through the engine's local executor (the machine's content-addressed cache first,
 * so a hit stays a hit whichever worker asks), and stores the outcome with the job's completion in one commit.
 */
function startSimulating(workerId: string, log: (line: string) => void): Loop {
  // Each slot keeps its ngspice process between groups: no process start per group (see checks/spice/session.ts).
  const executor = localExecutor({ concurrency: 1, keep: true });
  let stopping = false;
  let busy = 0;
  const running = new Set<Promise<void>>();
  let wake: (() => void) | null = null;
  const sleep = (ms: number) => new Promise<void>((resolve) => {
    const t = setTimeout(() => { wake = null; resolve(); }, ms);
    wake = () => { clearTimeout(t); wake = null; resolve(); };
  });

  const loop = (async () => {
    const queue = await startedBoss();
    while (!stopping) {
      const free = SIM_SLOTS - busy;
      const jobs = free > 0 ? await fetchJobs(queue, free).catch((err: Error) => {
        log(`simulate fetch failed: ${err.message}`);
        return [];
      }) : [];
      if (jobs.length === 0) { await sleep(free > 0 ? 500 : 1000); continue; }
      // As many groups as free slots, so two jobs on an idle two-slot worker still run side by side.
      const size = Math.ceil(jobs.length / free);
      for (let i = 0; i < jobs.length; i += size) {
        busy++;
        // The slot frees when ngspice ends: storing the outcomes overlaps the next simulation.
        const free = () => { busy--; wake?.(); };
        const p = simulateGroup(queue, executor, jobs.slice(i, i + size), workerId, free)
          .catch((err: Error) => log(`simulations ${jobs.slice(i, i + size).map((j) => j.id).join(", ")} not stored: ${err.message}`))
          .finally(() => running.delete(p));
        running.add(p);
      }
    }
  })();

  return {
    wake: () => wake?.(),
    stop: async () => {
      stopping = true;
      wake?.();
      await loop.catch(() => undefined);
      await Promise.all(running);
      executor.close();
    },
  };
}

async function fetchJobs(queue: PgBoss, slots: number): Promise<PgBoss.Job<SimJobData>[]> {
  const perSlot = SIM_GROUP > 1 ? groupSize(await queue.getQueueSize(SIMULATE_QUEUE)) : 1;
  return queue.fetch<SimJobData>(SIMULATE_QUEUE, { batchSize: slots * perSlot });
}

async function simulateGroup(queue: PgBoss, executor: SimExecutor, jobs: PgBoss.Job<SimJobData>[], workerId: string, free: () => void): Promise<void> {
  const outcomes = await executor.runMany(jobs.map((j) => j.data.request)).finally(free);
  const em = await getEm();
  await em.transactional(async (tx) => {
    const db = inTransaction(tx); // node-pg parameters: the raw file goes in as bytea, not as SQL text
    for (const [i, job] of jobs.entries()) {
      const { runId, request } = job.data;
      const o = outcomes[i];
      const inCache = o.ok && leftInCache(job.data, o);
      await db.executeSql(
        `insert into sim_results (run_id, key, ok, raw, raw_in_cache, error, line, ms, cached, worker_id, created_at)
         select $1, $2, $3, $4, $5, $6, $7, $8, $9, $10, now() where exists (select 1 from check_runs where id = $1)
         on conflict do nothing`,
        [runId, request.key, o.ok, o.ok && !inCache ? Buffer.from(o.raw) : null, inCache, o.ok ? null : o.error.slice(0, 2000), o.ok ? null : (o.line ?? null),
          o.ms, o.ok ? o.cached : false, workerId]);
      await queue.complete(SIMULATE_QUEUE, job.id, { worker: workerId, cached: o.ok && o.cached }, { db });
    }
    for (const runId of new Set(jobs.map((j) => j.data.runId))) await db.executeSql(`select pg_notify($1, $2)`, [SIM_CHANNEL, runId]);
  });
}

/**
 * When this worker sees the coordinator's cache (one machine, or a shared volume), the raw file goes there and the
 * table row only says so: a raw file is 100 kB and more, and through the database it cost both workers and
 * PostgreSQL more CPU than the short simulation itself. Our own executor has already put it there when the two
 * caches are one folder; otherwise it is written there now. False: it goes through the table.
 */
function leftInCache(job: SimJobData, o: SimOutcome & { ok: true }): boolean {
  if (!job.cache || !seesCache(job.cache)) return false;
  if (job.cache.dir === OWN_CACHE && holdsCached(OWN_CACHE, job.request.key)) return true;
  return writeCached(job.cache.dir, job.request.key, o.raw);
}
const OWN_CACHE = defaultCacheDir();

/** Outcomes are needed only while their run is open: kept ten minutes after it ends (for a look), a day at most. */
export async function pruneSimResults(): Promise<number> {
  const rows = await (await getEm()).getConnection().execute<unknown[]>(
    `delete from sim_results s where s.created_at < now() - interval '1 day'
        or (s.created_at < now() - interval '10 minutes'
            and exists (select 1 from check_runs r where r.id = s.run_id and r.status in ('done', 'error')))
     returning 1`);
  return rows.length;
}
