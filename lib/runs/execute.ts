import { ngspiceVersion, verifyBlock } from "@/checks";
import { getEm } from "@/lib/db/orm";
import { currentStamp } from "./badge";
import { claimRun, completeRun, failAttempt, LEASE_SECONDS, renewLease } from "./lease";

/** The engine's own limit per verification; the worker's guard adds a margin for a child that hangs. */
export const RUN_TIMEOUT_MS = Number(process.env.ASSAY_RUN_TIMEOUT_MS ?? 120_000);

export type Outcome = "idle" | "done" | "retry" | "error" | "lost";

export interface Progress {
  onClaim?: (runId: string) => void;
}

/** Claims one run, verifies it with the engine while renewing the lease, and stores the result. */
export async function processNext(workerId: string, opts: Progress = {}): Promise<{ outcome: Outcome; runId?: string }> {
  const em = await getEm();
  const claimed = await claimRun(em, workerId);
  if (!claimed) return { outcome: "idle" };
  opts.onClaim?.(claimed.id);
  let lost = false;
  const renew = setInterval(() => {
    renewLease(em, claimed.id, workerId).then((ok) => { if (!ok) lost = true; }, () => undefined);
  }, (LEASE_SECONDS * 1000) / 3);
  try {
    // Stamp before running: the result is only as current as the engine and models that made it.
    const stamp = currentStamp();
    const ngspice = ngspiceVersion();
    const t0 = performance.now();
    const { report, waveforms } = await withGuard(verifyBlock(claimed.text, { timeoutMs: RUN_TIMEOUT_MS }), RUN_TIMEOUT_MS + 15_000);
    if (lost) return { outcome: "lost", runId: claimed.id };
    const crash = infrastructureFailure(report);
    if (crash) throw new Error(crash);
    const ok = await completeRun(em, claimed.id, workerId, {
      report: report as unknown as Record<string, unknown>, waveforms, engineVersion: stamp.engineVersion,
      ngspiceVersion: ngspice, modelLibraryHash: stamp.modelLibraryHash, durationMs: performance.now() - t0,
      simulations: report.simulations?.length ?? 0,
    });
    return { outcome: ok ? "done" : "lost", runId: claimed.id };
  } catch (err) {
    const reason = `attempt ${claimed.attempts} failed: ${(err as Error)?.message ?? String(err)}`;
    return { outcome: await failAttempt(em, claimed.id, workerId, reason), runId: claimed.id };
  } finally {
    clearInterval(renew);
  }
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
