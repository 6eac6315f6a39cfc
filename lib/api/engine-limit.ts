import "server-only";
import { RateLimiterMemory, RateLimiterRes } from "rate-limiter-flexible";
import type { Caller } from "@/lib/auth/caller";
import { AppError } from "@/lib/errors";

// POST …/evaluate and …/retune run the engine (tolerance corners, and with `simulate` ngspice) for anyone who may
// read the block, signed-out visitors included for public blocks. Points per minute, memory store (one app process):
// a token or a signed-in user has a budget of its own; signed-out visitors share one budget per block and one for
// all blocks, since there is no client address we can believe without a trusted proxy (see lib/auth/rate-limit.ts).
// Costs: an evaluation without simulation 1 point (the fork page's live preview, debounced), a retune 2, an
// evaluation with simulation 6. Defaults let one person edit at typing speed and stop a loop from hogging 2 cores.

export type EngineCall = "evaluate" | "simulate" | "retune";
const COST: Record<EngineCall, number> = { evaluate: 1, retune: 2, simulate: 6 };

const envInt = (name: string, fallback: number): number => {
  const n = Number(process.env[name]);
  return Number.isInteger(n) && n > 0 ? n : fallback;
};

/** Budgets in points per minute; ASSAY_ENGINE_POINTS, ASSAY_ENGINE_ANON_BLOCK_POINTS, ASSAY_ENGINE_ANON_POINTS move them. */
export const engineBudgets = () => ({
  // The live preview asks on every pause in typing: a signed-in engineer needs a few a second at most.
  caller: envInt("ASSAY_ENGINE_POINTS", 300),
  anonBlock: envInt("ASSAY_ENGINE_ANON_BLOCK_POINTS", 20),
  anonAll: envInt("ASSAY_ENGINE_ANON_POINTS", 60),
});

const holder = globalThis as unknown as { __assayEngineLimiters?: Map<string, RateLimiterMemory> };
function limiter(name: string, points: number): RateLimiterMemory {
  holder.__assayEngineLimiters ??= new Map();
  const key = `${name}:${points}`;
  let l = holder.__assayEngineLimiters.get(key);
  if (!l) holder.__assayEngineLimiters.set(key, (l = new RateLimiterMemory({ keyPrefix: `engine-${name}`, points, duration: 60 })));
  return l;
}

/** The buckets one call is counted in: [limiter name, budget, key]. */
export function engineBuckets(caller: Caller, slug: string): [string, number, string][] {
  const b = engineBudgets();
  if (caller.token) return [["caller", b.caller, `token:${caller.token.id}`]];
  if (caller.user) return [["caller", b.caller, `user:${caller.user.id}`]];
  return [["anon-block", b.anonBlock, slug], ["anon-all", b.anonAll, "all"]];
}

/** Counts one engine call; over a budget → AppError("rate_limited") carrying retryAfter in seconds (→ Retry-After). */
export async function consumeEngine(caller: Caller, slug: string, call: EngineCall): Promise<void> {
  for (const [name, points, key] of engineBuckets(caller, slug)) {
    try {
      await limiter(name, points).consume(key, Math.min(COST[call], points));
    } catch (e) {
      if (!(e instanceof RateLimiterRes)) throw e;
      const retryAfter = Math.max(1, Math.ceil(e.msBeforeNext / 1000));
      const whose = name === "caller" ? "for this caller" : name === "anon-block" ? "for this block while signed out" : "while signed out";
      throw new AppError("rate_limited", `too many engine runs ${whose}; try again in ${retryAfter} s`, { retryAfter });
    }
  }
}

/** Wall time of engine work worth one more point: a heavy call (many parameters, corners) drains the budget by its work. */
export const WORK_MS_PER_POINT = 250;

/**
 * Counts one engine call up front, runs it, then charges the budget by the work it took (`penalty` never refuses:
 * the next call is the one that waits).
 */
export async function engineCall<T>(caller: Caller, slug: string, call: EngineCall, work: () => Promise<T>): Promise<T> {
  await consumeEngine(caller, slug, call);
  const t0 = performance.now();
  try {
    return await work();
  } finally {
    const extra = Math.floor((performance.now() - t0) / WORK_MS_PER_POINT);
    if (extra > 0) for (const [name, points, key] of engineBuckets(caller, slug)) await limiter(name, points).penalty(key, extra);
  }
}
