import type { EntityManager } from "@mikro-orm/postgresql";
import { BlockSchema, BlockVersionSchema, type CheckRun } from "@/entities";
import { blockEventBase } from "@/lib/blocks/events";
import { writeEvent } from "@/lib/outbox/outbox";
import { badgeOfRun, currentStamp, latestRuns, type Badge } from "./badge";

/**
 * The run queue is the check_runs table itself: a worker leases a row with FOR UPDATE SKIP LOCKED
 * (two workers never take the same run), renews the lease while it works, and finishes only while it
 * still holds the lease. A worker that dies stops renewing; when the lease expires another worker takes
 * the run again, up to MAX_ATTEMPTS, after which the run ends as `error` with the reason.
 * Chosen over pg-boss because the version, its run and its job are then one row in one transaction.
 */
export const LEASE_SECONDS = Number(process.env.ASSAY_RUN_LEASE_SECONDS ?? 30);
export const MAX_ATTEMPTS = Number(process.env.ASSAY_RUN_MAX_ATTEMPTS ?? 3);

export interface ClaimedRun {
  id: string;
  versionId: number;
  attempts: number;
  text: string;
}

const exec = async <T>(em: EntityManager, sql: string, params: unknown[] = []): Promise<T> =>
  (await em.getConnection().execute(sql, params, "all", em.getTransactionContext())) as T;

/** Takes the oldest claimable run: queued, or running with an expired lease and attempts left. */
export async function claimRun(em: EntityManager, workerId: string, opts: { teamIds?: number[] } = {}): Promise<ClaimedRun | null> {
  const teamFilter = opts.teamIds?.length ? `and b.team_id in (${opts.teamIds.map(() => "?").join(",")})` : "";
  const rows = await exec<{ id: string; version_id: number; attempts: number }[]>(em,
    `update check_runs r set status = 'running', leased_by = ?, lease_until = now() + make_interval(secs => ?),
            attempts = r.attempts + 1, started_at = now(),
            error = case when r.status = 'running' then 'the previous attempt''s worker stopped responding' else r.error end
      where r.id = (
        select c.id from check_runs c
          join block_versions v on v.id = c.version_id join blocks b on b.id = v.block_id
         where (c.status = 'queued' or (c.status = 'running' and c.lease_until < now())) and c.attempts < ? ${teamFilter}
         order by (c.trigger = 'reverify'), c.created_at
         limit 1 for update of c skip locked)
      returning r.id, r.version_id, r.attempts`,
    [workerId, LEASE_SECONDS, MAX_ATTEMPTS, ...(opts.teamIds ?? [])]);
  if (rows.length === 0) return null;
  const [v] = await exec<{ text: string }[]>(em, `select text from block_versions where id = ?`, [rows[0].version_id]);
  return { id: rows[0].id, versionId: Number(rows[0].version_id), attempts: rows[0].attempts, text: v.text };
}

/** Heartbeat: false when the lease is no longer ours (it expired and another worker took the run). */
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
  durationMs: number;
}

/** Stores the result if the lease is still ours; exactly one attempt can do so. Writes `run.finished`. */
export async function completeRun(em: EntityManager, runId: string, workerId: string, r: RunResult): Promise<boolean> {
  return em.transactional(async (tx) => {
    const rows = await exec<unknown[]>(tx,
      `update check_runs set status = 'done', report = ?, waveforms = ?, engine_version = ?, ngspice_version = ?,
              model_library_hash = ?, duration_ms = ?, finished_at = now(), leased_by = null, lease_until = null, error = null
        where id = ? and leased_by = ? and status = 'running' returning id`,
      [JSON.stringify(r.report), JSON.stringify(r.waveforms), r.engineVersion, r.ngspiceVersion, r.modelLibraryHash,
        Math.round(r.durationMs), runId, workerId]);
    if (rows.length === 0) return false;
    await finishedEvent(tx, runId);
    return true;
  });
}

/** A crash or timeout of this attempt: back to the queue while attempts remain, else `error` with the reason. */
export async function failAttempt(em: EntityManager, runId: string, workerId: string, reason: string): Promise<"retry" | "error" | "lost"> {
  return em.transactional(async (tx) => {
    const rows = await exec<{ status: string }[]>(tx,
      `update check_runs set status = case when attempts >= ? then 'error' else 'queued' end,
              error = ?, leased_by = null, lease_until = null,
              finished_at = case when attempts >= ? then now() else null end
        where id = ? and leased_by = ? and status = 'running' returning status`,
      [MAX_ATTEMPTS, reason.slice(0, 2000), MAX_ATTEMPTS, runId, workerId]);
    if (rows.length === 0) return "lost";
    if (rows[0].status === "error") await finishedEvent(tx, runId);
    return rows[0].status === "error" ? "error" : "retry";
  });
}

/** On a clean shutdown: hand the run back without counting the attempt. */
export async function releaseRun(em: EntityManager, runId: string, workerId: string): Promise<void> {
  await exec(em, `update check_runs set status = 'queued', attempts = greatest(attempts - 1, 0), leased_by = null, lease_until = null
                   where id = ? and leased_by = ? and status = 'running' returning id`, [runId, workerId]);
}

/** Runs whose worker died on the last allowed attempt: nobody may claim them any more, so they end as errors. */
export async function reapExpired(em: EntityManager): Promise<number> {
  return em.transactional(async (tx) => {
    const rows = await exec<{ id: string }[]>(tx,
      `update check_runs set status = 'error', finished_at = now(), leased_by = null, lease_until = null,
              error = 'the worker stopped responding on each of ' || attempts || ' attempts (crash, kill or time-out)'
        where id in (select id from check_runs where status = 'running' and lease_until < now() and attempts >= ?
                     for update skip locked)
        returning id`, [MAX_ATTEMPTS]);
    for (const r of rows) await finishedEvent(tx, r.id);
    return rows.length;
  });
}

/** `run.finished` with the new and the previous badge, so the mailer can tell a head that turned failing. */
async function finishedEvent(tx: EntityManager, runId: string): Promise<void> {
  const [run] = await exec<Record<string, unknown>[]>(tx,
    `select id, version_id, status, report, engine_version, model_library_hash, error, trigger from check_runs where id = ?`, [runId]);
  const version = await tx.findOneOrFail(BlockVersionSchema, { id: Number(run.version_id) });
  const block = await tx.findOneOrFail(BlockSchema, { id: version.block.id }, { populate: ["team", "head"] });
  const stamp = currentStamp();
  const badge = badgeOfRun({
    status: run.status as CheckRun["status"], report: run.report as CheckRun["report"],
    engineVersion: run.engine_version as string | null, modelLibraryHash: run.model_library_hash as string | null,
  }, stamp);
  writeEvent(tx, "run.finished", {
    ...(await blockEventBase(tx, block, version)),
    runId, status: run.status, trigger: run.trigger, error: run.error ?? null,
    reportStatus: (run.report as { status?: string } | null)?.status ?? null,
    badge, previousBadge: await previousBadge(tx, runId, version.id, block.id, version.number, stamp),
    isHead: block.head?.id === version.id,
  });
  await tx.flush();
}

/** What the block showed before this result: this version's earlier finished run, else the version before it. */
async function previousBadge(tx: EntityManager, runId: string, versionId: number, blockId: number, number: number, stamp: ReturnType<typeof currentStamp>): Promise<Badge | null> {
  const [earlier] = await exec<Record<string, unknown>[]>(tx,
    `select status, report, engine_version, model_library_hash from check_runs
      where version_id = ? and id <> ? and status in ('done', 'error') order by finished_at desc nulls last limit 1`, [versionId, runId]);
  const asRun = (r: Record<string, unknown>) => ({
    status: r.status as CheckRun["status"], report: r.report as CheckRun["report"],
    engineVersion: r.engine_version as string | null, modelLibraryHash: r.model_library_hash as string | null,
  });
  if (earlier) return badgeOfRun(asRun(earlier), stamp);
  if (number <= 1) return null;
  const [prev] = await exec<{ id: number }[]>(tx, `select id from block_versions where block_id = ? and number = ?`, [blockId, number - 1]);
  if (!prev) return null;
  const run = (await latestRuns(tx, [prev.id])).get(prev.id);
  return badgeOfRun(run ?? null, stamp);
}
