import type { EntityManager } from "@mikro-orm/postgresql";
import type { RunModel, RunTrigger } from "@/entities";
import { boss, inTransaction, startedBoss, VERIFY_QUEUE } from "@/lib/queue/boss";
import { finishedEvent } from "./finished-event";
import { MAX_ATTEMPTS, verifyJobOptions } from "./job-options";

/**
 * pg-boss delivers each run as a `verify` job; the check_runs row is the record users see. A worker takes the
 * job and leases the row in one transaction (attempts + 1), renews the lease while it works (the heartbeat users
 * see), and finishes the row and the job together, only while it still holds the lease. A worker that dies stops
 * renewing: once the lease lapses any worker fails the job, pg-boss hands it out again, and after MAX_ATTEMPTS
 * the run ends as `error` with the reason. pg-boss's own expiry stays a backstop.
 */
export const LEASE_SECONDS = Number(process.env.ASSAY_RUN_LEASE_SECONDS ?? 30);
export { MAX_ATTEMPTS };

export interface ClaimedRun {
  id: string;
  versionId: number;
  attempts: number;
  text: string;
}

const exec = async <T>(em: EntityManager, sql: string, params: unknown[] = []): Promise<T> =>
  (await em.getConnection().execute(sql, params, "all", em.getTransactionContext())) as T;

/** Takes the next verify job and leases its run; null when no job is waiting. */
export async function claimRun(em: EntityManager, workerId: string): Promise<ClaimedRun | null> {
  const queue = await startedBoss();
  await requeueLost(em);
  for (;;) {
    const claimed = await em.transactional(async (tx) => {
      const [job] = await queue.fetch<{ runId: string }>(VERIFY_QUEUE, { batchSize: 1, db: inTransaction(tx) });
      if (!job) return null;
      const rows = await exec<{ id: string; version_id: number; attempts: number }[]>(tx,
        `update check_runs set status = 'running', leased_by = ?, lease_until = now() + make_interval(secs => ?),
                attempts = attempts + 1, started_at = now(), job_id = ?
          where id = ? and status = 'queued' returning id, version_id, attempts`,
        [workerId, LEASE_SECONDS, job.id, job.data.runId]);
      if (rows.length === 0) {
        // A stray delivery (the run ended, or a live attempt holds it): nothing to do for this job.
        await queue.complete(VERIFY_QUEUE, job.id, { stray: true }, { db: inTransaction(tx) });
        return "stray" as const;
      }
      const [v] = await exec<{ text: string }[]>(tx, `select text from block_versions where id = ?`, [rows[0].version_id]);
      return { id: rows[0].id, versionId: Number(rows[0].version_id), attempts: rows[0].attempts, text: v.text };
    });
    if (claimed !== "stray") return claimed;
  }
}

/** Heartbeat: false when the lease is no longer ours (it lapsed and the run went back to the queue). */
export async function renewLease(em: EntityManager, runId: string, workerId: string): Promise<boolean> {
  const rows = await exec<unknown[]>(em,
    `update check_runs set lease_until = now() + make_interval(secs => ?)
      where id = ? and leased_by = ? and status = 'running' returning id`, [LEASE_SECONDS, runId, workerId]);
  return rows.length === 1;
}

export interface RunResult {
  report: Record<string, unknown>;
  waveforms: unknown[];
  engineVersion: string;
  ngspiceVersion: string;
  modelLibraryHash: string;
  models: RunModel[];
  modelsOutdated: boolean;
  durationMs: number;
  /** Simulations the run took, cache hits included: done and total of its progress once it is done. */
  simulations: number;
}

/** The run's simulations so far, while this worker holds it; false when the lease is no longer ours. */
export async function recordProgress(em: EntityManager, runId: string, workerId: string, p: { done: number; total: number }): Promise<boolean> {
  const rows = await exec<unknown[]>(em,
    `update check_runs set progress_done = ?, progress_total = ?
      where id = ? and leased_by = ? and status = 'running' returning id`, [p.done, p.total, runId, workerId]);
  return rows.length === 1;
}

/** Stores the result and completes the job if the lease is still ours; exactly one attempt can. Writes `run.finished`. */
export async function completeRun(em: EntityManager, runId: string, workerId: string, r: RunResult): Promise<boolean> {
  return em.transactional(async (tx) => {
    const rows = await exec<{ job_id: string | null }[]>(tx,
      `update check_runs set status = 'done', report = ?, waveforms = ?, engine_version = ?, ngspice_version = ?,
              model_library_hash = ?, models = ?, models_outdated = ?, duration_ms = ?, finished_at = now(), leased_by = null,
              lease_until = null, error = null, progress_done = ?, progress_total = ?
        where id = ? and leased_by = ? and status = 'running' returning job_id`,
      [JSON.stringify(r.report), JSON.stringify(r.waveforms), r.engineVersion, r.ngspiceVersion, r.modelLibraryHash,
        JSON.stringify(r.models), r.modelsOutdated, Math.round(r.durationMs), r.simulations, r.simulations, runId, workerId]);
    if (rows.length === 0) return false;
    if (rows[0].job_id) await boss().complete(VERIFY_QUEUE, rows[0].job_id, { runId }, { db: inTransaction(tx) });
    await finishedEvent(tx, runId);
    return true;
  });
}

/** A crash or timeout of this attempt: back to the queue while attempts remain, else `error` with the reason. */
export async function failAttempt(em: EntityManager, runId: string, workerId: string, reason: string): Promise<"retry" | "error" | "lost"> {
  return em.transactional(async (tx) => {
    const rows = await exec<{ status: string; job_id: string | null; trigger: RunTrigger }[]>(tx,
      `update check_runs set status = case when attempts >= ? then 'error' else 'queued' end,
              error = ?, leased_by = null, lease_until = null,
              finished_at = case when attempts >= ? then now() else null end
        where id = ? and leased_by = ? and status = 'running' returning status, job_id, trigger`,
      [MAX_ATTEMPTS, reason.slice(0, 2000), MAX_ATTEMPTS, runId, workerId]);
    if (rows.length === 0) return "lost";
    const [row] = rows;
    if (row.status === "error") {
      if (row.job_id) await boss().fail(VERIFY_QUEUE, row.job_id, { reason }, { db: inTransaction(tx) });
      await finishedEvent(tx, runId);
      return "error";
    }
    await retryJob(tx, runId, row.job_id, row.trigger, reason);
    return "retry";
  });
}

/** On a clean shutdown: hand the run back without counting the attempt (a fresh job, so no pg-boss retry is spent). */
export async function releaseRun(em: EntityManager, runId: string, workerId: string): Promise<void> {
  await em.transactional(async (tx) => {
    const rows = await exec<{ job_id: string | null; trigger: RunTrigger }[]>(tx,
      `update check_runs set status = 'queued', attempts = greatest(attempts - 1, 0), leased_by = null, lease_until = null
        where id = ? and leased_by = ? and status = 'running' returning job_id, trigger`, [runId, workerId]);
    if (rows.length) await replaceJob(tx, runId, rows[0].job_id, rows[0].trigger);
  });
}

/** Runs whose worker stopped renewing with attempts left go back to the queue: their job is failed into a retry. */
export async function requeueLost(em: EntityManager): Promise<number> {
  return em.transactional(async (tx) => {
    const rows = await exec<{ id: string; job_id: string | null; trigger: RunTrigger }[]>(tx,
      `update check_runs set status = 'queued', leased_by = null, lease_until = null,
              error = 'the previous attempt''s worker stopped responding'
        where id in (select id from check_runs where status = 'running' and lease_until < now() and attempts < ?
                     for update skip locked)
        returning id, job_id, trigger`, [MAX_ATTEMPTS]);
    for (const r of rows) await retryJob(tx, r.id, r.job_id, r.trigger, "the worker stopped responding");
    return rows.length;
  });
}

/** Runs whose worker died on the last allowed attempt: nobody may take them any more, so they end as errors. */
export async function reapExpired(em: EntityManager): Promise<number> {
  return em.transactional(async (tx) => {
    const rows = await exec<{ id: string; job_id: string | null }[]>(tx,
      `update check_runs set status = 'error', finished_at = now(), leased_by = null, lease_until = null,
              error = 'the worker stopped responding on each of ' || attempts || ' attempts (crash, kill or time-out)'
        where id in (select id from check_runs where status = 'running' and lease_until < now() and attempts >= ?
                     for update skip locked)
        returning id, job_id`, [MAX_ATTEMPTS]);
    for (const r of rows) {
      if (r.job_id) await boss().fail(VERIFY_QUEUE, r.job_id, { reason: "the worker stopped responding" }, { db: inTransaction(tx) });
      await finishedEvent(tx, r.id);
    }
    return rows.length;
  });
}

/** pg-boss's retry of the run's job; a job pg-boss no longer holds as active or waiting is replaced by a new one. */
async function retryJob(tx: EntityManager, runId: string, jobId: string | null, trigger: RunTrigger, reason: string): Promise<void> {
  if (jobId) {
    await boss().fail(VERIFY_QUEUE, jobId, { reason }, { db: inTransaction(tx) });
    const job = await boss().getJobById(VERIFY_QUEUE, jobId, { db: inTransaction(tx), includeArchive: false });
    if (job?.state === "retry") return;
  }
  await replaceJob(tx, runId, jobId, trigger);
}

async function replaceJob(tx: EntityManager, runId: string, jobId: string | null, trigger: RunTrigger): Promise<void> {
  if (jobId) await boss().cancel(VERIFY_QUEUE, jobId, { db: inTransaction(tx) });
  const fresh = await boss().send(VERIFY_QUEUE, { runId }, { ...verifyJobOptions(trigger), db: inTransaction(tx) });
  await exec(tx, `update check_runs set job_id = ? where id = ?`, [fresh, runId]);
}
