import { randomUUID } from "node:crypto";
import type { EntityManager } from "@mikro-orm/postgresql";
import { CheckRunSchema, type BlockVersion, type CheckRun, type RunTrigger } from "@/entities";
import { boss, inTransaction, VERIFY_QUEUE } from "@/lib/queue/boss";
import { verifyJobOptions } from "./job-options";

export const RUN_CHANNEL = "assay_runs";

/**
 * Queues a check run in the caller's transaction: the CheckRun row (the record users see) and its pg-boss job
 * commit together or not at all. New versions go before reverification of unchanged heads.
 * The NOTIFY, delivered only on commit, wakes idle workers before their next poll.
 */
export async function enqueueRun(em: EntityManager, version: BlockVersion, trigger: RunTrigger): Promise<CheckRun> {
  const id = randomUUID();
  const jobId = await boss().send(VERIFY_QUEUE, { runId: id }, { ...verifyJobOptions(trigger), db: inTransaction(em) });
  const run = em.create(CheckRunSchema, {
    id, version, status: "queued", report: null, waveforms: null, engineVersion: null, ngspiceVersion: null,
    modelLibraryHash: null, durationMs: null, attempts: 0, trigger, error: null, leasedBy: null, leaseUntil: null,
    jobId, progressDone: 0, progressTotal: 0, startedAt: null, finishedAt: null, createdAt: new Date(),
  });
  await em.getConnection().execute(`select pg_notify('${RUN_CHANNEL}', '')`, [], "run", em.getTransactionContext());
  return run;
}
