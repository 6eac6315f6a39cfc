import type { SimRequest } from "./executor";
import type { Verification } from "./verification";

/** Per-run limits on work, checked before anything runs. */
export type RunCap = { simulations: number; simSeconds: number };

export const DEFAULT_RUN_CAP: RunCap = { simulations: 2000, simSeconds: 200 };

/** ASSAY_RUN_MAX_SIMULATIONS and ASSAY_RUN_MAX_SIM_SECONDS (simulated time, summed over a run's transients). */
export function runCapFromEnv(env: Record<string, string | undefined> = process.env): RunCap {
  const read = (v: string | undefined, d: number) => (Number.isFinite(Number(v)) && Number(v) > 0 ? Number(v) : d);
  return {
    simulations: read(env.ASSAY_RUN_MAX_SIMULATIONS, DEFAULT_RUN_CAP.simulations),
    simSeconds: read(env.ASSAY_RUN_MAX_SIM_SECONDS, DEFAULT_RUN_CAP.simSeconds),
  };
}

/**
 * How many simulations a run needs: the variants it will evaluate times the simulations the
 * nominal variant asked for in its first pass (a later pass of a two-stage script adds more,
 * so `total` only grows as the run learns).
 */
export function planFor(v: Verification, first: SimRequest[], simulatedChecks: number) {
  const variants = v.plannedVariants(simulatedChecks);
  const perVariant = Math.max(1, v.firstRequests.length);
  const estimate = variants * perVariant;
  const seconds = variants * v.firstRequests.reduce((s, r) => s + r.simSeconds, 0);
  let seen = 0;
  return {
    variants,
    perVariant,
    total: () => Math.max(estimate, seen, first.length),
    saw: (n: number) => void (seen += n),
    exceeds(cap: RunCap): string | null {
      const over = estimate > cap.simulations || seconds > cap.simSeconds;
      if (!over) return null;
      return (
        `this run needs about ${estimate} simulations (${variants} variants × ${perVariant}) and ${+seconds.toPrecision(3)} s of simulated time; ` +
        `this instance allows at most ${cap.simulations} simulations and ${cap.simSeconds} s per run ` +
        `(ASSAY_RUN_MAX_SIMULATIONS, ASSAY_RUN_MAX_SIM_SECONDS): lower montecarlo(N), the sweep or the transient's stop time`
      );
    },
  };
}
