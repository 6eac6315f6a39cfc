import type { EntityManager } from "@mikro-orm/postgresql";
import { CheckRunSchema, type BlockVersion, type CheckRun, type RunTrigger } from "@/entities";

export const RUN_CHANNEL = "assay_runs";

/**
 * Queues a check run in the caller's transaction: the CheckRun row is the job (workers lease it, see lease.ts),
 * so a version and its run commit together or not at all. The NOTIFY is delivered only on commit.
 */
export async function enqueueRun(em: EntityManager, version: BlockVersion, trigger: RunTrigger): Promise<CheckRun> {
  const run = em.create(CheckRunSchema, {
    version, status: "queued", report: null, waveforms: null, engineVersion: null, ngspiceVersion: null,
    modelLibraryHash: null, durationMs: null, attempts: 0, trigger, error: null, leasedBy: null, leaseUntil: null,
    startedAt: null, finishedAt: null, createdAt: new Date(),
  });
  await em.getConnection().execute(`select pg_notify('${RUN_CHANNEL}', '')`, [], "run", em.getTransactionContext());
  return run;
}
