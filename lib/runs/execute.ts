import { ngspiceVersion, runCapFromEnv, verifyBlock } from "@/checks";
import { getEm } from "@/lib/db/orm";
import { modelsChangedSince, resolveForVersion, runModels } from "@/lib/models/resolve";
import { currentStamp } from "./badge";
import { claimRun, completeRun, failAttempt, LEASE_SECONDS, recordProgress, renewLease } from "./lease";
import { enqueueStaleHeads } from "./reverify";
import { queueExecutor } from "./sim-executor";
import { simulating } from "./sim-worker";

/** The engine's own limit per verification; the worker's guard adds a margin for a child that hangs. */
export const RUN_TIMEOUT_MS = Number(process.env.ASSAY_RUN_TIMEOUT_MS ?? 120_000);

export type Outcome = "idle" | "done" | "retry" | "error" | "lost";

export interface Progress {
  onClaim?: (runId: string) => void;
}

/** Claims one run, verifies it with the engine while renewing the lease, and stores the result. */
export async function processNext(workerId: string, opts: Progress = {}): Promise<{ outcome: Outcome; runId?: string }> {
  const em = await getEm();
  simulating(workerId); // this process runs simulations too, so one worker alone finishes what it fans out
  const claimed = await claimRun(em, workerId);
  if (!claimed) return { outcome: "idle" };
  opts.onClaim?.(claimed.id);
  let lost = false;
  const renew = setInterval(() => {
    renewLease(em, claimed.id, workerId).then((ok) => { if (!ok) lost = true; }, () => undefined);
  }, (LEASE_SECONDS * 1000) / 3);
  const progress = progressWriter((p) => recordProgress(em, claimed.id, workerId, p));
  const executor = queueExecutor({ id: claimed.id, attempt: claimed.attempts }, progress.update);
  try {
    // Stamp before running: the result is only as current as the engine and models that made it.
    const stamp = currentStamp();
    const ngspice = ngspiceVersion();
    const t0 = performance.now();
    // The team's model files as they are now; the run records exactly which versions it simulated with.
    const models = await resolveForVersion(em, claimed.versionId, claimed.text);
    const { report, waveforms } = await withGuard(verifyBlock(claimed.text, {
      timeoutMs: RUN_TIMEOUT_MS, executor, onProgress: progress.update, cap: runCapFromEnv(), models: models.texts,
    }), RUN_TIMEOUT_MS + 15_000);
    await progress.flush();
    if (lost) return { outcome: "lost", runId: claimed.id };
    if (executor.failure) throw executor.failure;
    const crash = infrastructureFailure(report);
    if (crash) throw new Error(crash);
    // An upload while this run was simulating: the result is stored as stale and the heads are queued again.
    const outdated = await modelsChangedSince(em, claimed.versionId, claimed.text, runModels(models));
    const ok = await completeRun(em, claimed.id, workerId, {
      report: report as unknown as Record<string, unknown>, waveforms, engineVersion: stamp.engineVersion,
      ngspiceVersion: ngspice, modelLibraryHash: stamp.modelLibraryHash, models: runModels(models), modelsOutdated: outdated,
      durationMs: performance.now() - t0, simulations: progress.last?.total ?? report.simulations?.length ?? 0,
    });
    if (ok && outdated) await enqueueStaleHeads(em);
    return { outcome: ok ? "done" : "lost", runId: claimed.id };
  } catch (err) {
    const reason = `attempt ${claimed.attempts} failed: ${(err as Error)?.message ?? String(err)}`;
    return { outcome: await failAttempt(em, claimed.id, workerId, reason), runId: claimed.id };
  } finally {
    clearInterval(renew);
    await executor.close();
  }
}

/**
 * Progress from two sources: the engine's plan (its total may grow) and the executor's count of outcomes
 * within a batch. Written to the run row at most every 300 ms and once more at the end.
 */
function progressWriter(write: (p: { done: number; total: number }) => Promise<unknown>) {
  let last: { done: number; total: number } | undefined;
  let written: typeof last;
  let pending: Promise<unknown> = Promise.resolve();
  let timer: NodeJS.Timeout | null = null;
  const flush = () => {
    if (timer) clearTimeout(timer);
    timer = null;
    if (last && last !== written) {
      written = last;
      const p = last;
      pending = pending.then(() => write(p)).catch(() => undefined);
    }
    return pending;
  };
  return {
    get last() { return last; },
    update: (done: number, total: number) => {
      last = { done: Math.max(done, last?.done ?? 0), total: Math.max(total, done, last?.total ?? 0) };
      timer ??= setTimeout(flush, 300);
    },
    flush,
  };
}

/**
 * The engine reports a sandbox that was killed for time or that died as an error report; those say nothing
 * about the block (the machine may have been busy), so they are retried. Script errors and out-of-memory are
 * the block's own result and are stored.
 */
const TRANSIENT = /took longer than .* and was stopped|the sandbox stopped|the sandbox did not start/;
function infrastructureFailure(report: { checks?: unknown[]; errors?: { message: string }[] }): string | null {
  const errors = report.errors ?? [];
  if ((report.checks ?? []).length > 0 || errors.length !== 1) return null;
  return TRANSIENT.test(errors[0].message) ? errors[0].message : null;
}

function withGuard<T>(p: Promise<T>, ms: number): Promise<T> {
  let timer: NodeJS.Timeout;
  const guard = new Promise<never>((_, reject) => {
    timer = setTimeout(() => reject(new Error(`no answer from the engine within ${Math.round(ms / 1000)} s`)), ms);
  });
  return Promise.race([p, guard]).finally(() => clearTimeout(timer));
}
