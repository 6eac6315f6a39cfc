import type { EntityManager } from "@mikro-orm/postgresql";
import { BlockSchema, BlockVersionSchema, type CheckRun } from "@/entities";
import { blockEventBase } from "@/lib/blocks/events";
import { writeEvent } from "@/lib/outbox/outbox";
import { badgeOfRun, currentStamp, latestRuns, type Badge } from "./badge";

const exec = async <T>(em: EntityManager, sql: string, params: unknown[] = []): Promise<T> =>
  (await em.getConnection().execute(sql, params, "all", em.getTransactionContext())) as T;

/** `run.finished` with the new and the previous badge, so the mailer can tell a head that turned failing. */
export async function finishedEvent(tx: EntityManager, runId: string): Promise<void> {
  const [run] = await exec<Record<string, unknown>[]>(tx,
    `select id, version_id, status, report, engine_version, model_library_hash, models_outdated, error, trigger from check_runs where id = ?`, [runId]);
  const version = await tx.findOneOrFail(BlockVersionSchema, { id: Number(run.version_id) });
  const block = await tx.findOneOrFail(BlockSchema, { id: version.block.id }, { populate: ["team", "head"] });
  const stamp = currentStamp();
  const badge = badgeOfRun({
    status: run.status as CheckRun["status"], report: run.report as CheckRun["report"],
    engineVersion: run.engine_version as string | null, modelLibraryHash: run.model_library_hash as string | null,
    modelsOutdated: Boolean(run.models_outdated),
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
    `select status, report, engine_version, model_library_hash, models_outdated from check_runs
      where version_id = ? and id <> ? and status in ('done', 'error') order by finished_at desc nulls last limit 1`, [versionId, runId]);
  const asRun = (r: Record<string, unknown>) => ({
    status: r.status as CheckRun["status"], report: r.report as CheckRun["report"],
    engineVersion: r.engine_version as string | null, modelLibraryHash: r.model_library_hash as string | null,
    modelsOutdated: Boolean(r.models_outdated),
  });
  if (earlier) return badgeOfRun(asRun(earlier), stamp);
  if (number <= 1) return null;
  const [prev] = await exec<{ id: number }[]>(tx, `select id from block_versions where block_id = ? and number = ?`, [blockId, number - 1]);
  if (!prev) return null;
  const run = (await latestRuns(tx, [prev.id])).get(prev.id);
  return badgeOfRun(run ?? null, stamp);
}
