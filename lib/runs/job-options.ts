import type PgBoss from "pg-boss";
import type { RunTrigger } from "@/entities";

/** Attempts per run, counted on the check_runs row; pg-boss retries a failed attempt's job up to one less. */
export const MAX_ATTEMPTS = Number(process.env.ASSAY_RUN_MAX_ATTEMPTS ?? 3);

/**
 * A verify job: retried at once after a failed attempt. Its expiry is only a backstop: a worker's death is noticed
 * from its lapsed heartbeat on the run row (lease.ts), which also fails the job so pg-boss hands it out again.
 */
export function verifyJobOptions(trigger: RunTrigger): PgBoss.SendOptions {
  return { priority: trigger === "reverify" ? 0 : 1, retryLimit: Math.max(0, MAX_ATTEMPTS - 1), retryDelay: 0, expireInSeconds: 3600 };
}
