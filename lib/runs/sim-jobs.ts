import { createHash } from "node:crypto";
import type { CacheIdentity, SimRequest } from "@/checks";

/** Woken by NOTIFY: `simulate` jobs were sent (payload empty), or a result of a run came back (payload the run id). */
export const SIM_CHANNEL = "assay_sims";

/**
 * One ngspice run is bounded by the engine (20 s), and a worker runs the few jobs it takes at once (SIM_GROUP, short
 * ones sharing a process) in about that time, so a `simulate` job still active well after it lost its worker:
 * pg-boss's maintenance then fails it into a retry for another worker, up to SIM_MAX_ATTEMPTS in all.
 */
export const SIM_EXPIRE_SECONDS = Number(process.env.ASSAY_SIM_EXPIRE_SECONDS ?? 60);
export const SIM_MAX_ATTEMPTS = Number(process.env.ASSAY_SIM_MAX_ATTEMPTS ?? 3);

export interface SimJobData {
  runId: string;
  request: SimRequest;
  /** The coordinator's simulation cache: a worker that sees it leaves the raw file there, not in sim_results. */
  cache?: CacheIdentity | null;
}

/** The same request of the same attempt of a run is one job, however often the engine asks for it. */
export function simJobId(runId: string, attempt: number, key: string): string {
  const h = createHash("sha256").update(`${runId}/${attempt}/${key}`).digest("hex");
  return `${h.slice(0, 8)}-${h.slice(8, 12)}-4${h.slice(13, 16)}-8${h.slice(17, 20)}-${h.slice(20, 32)}`;
}
