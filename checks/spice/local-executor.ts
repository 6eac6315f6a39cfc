import os from "node:os";
import type { SimExecutor, SimOutcome, SimRequest } from "../engine/executor";
import { readCached, writeCached } from "./cache";
import { defaultCacheDir } from "./paths";
import { runNgspiceAsync } from "./run-ngspice";
import { SpiceError } from "./types";

export type LocalExecutorOptions = { cacheDir?: string; noCache?: boolean; concurrency?: number; timeoutMs?: number };

/** How many ngspice processes run at once by default: one per core. */
export const defaultConcurrency = () => Math.max(1, os.availableParallelism?.() ?? os.cpus().length);

/**
 * The executor of one machine: the content-addressed cache first, then ngspice processes,
 * up to one per core at a time. Identical requests in one batch run once.
 */
export function localExecutor(opts: LocalExecutorOptions = {}): SimExecutor {
  const dir = opts.cacheDir ?? defaultCacheDir();
  const limit = Math.max(1, opts.concurrency ?? defaultConcurrency());
  return {
    async runMany(reqs, progress) {
      const unique = new Map<string, SimRequest>();
      for (const r of reqs) if (!unique.has(r.key)) unique.set(r.key, r);
      const outcomes = new Map<string, SimOutcome>();
      let done = 0;
      const finish = (o: SimOutcome) => {
        outcomes.set(o.key, o);
        done += reqs.filter((r) => r.key === o.key).length;
        progress?.(done, reqs.length);
      };
      const queue: SimRequest[] = [];
      for (const r of unique.values()) {
        const hit = opts.noCache ? null : readCached(dir, r.key);
        if (hit) finish({ key: r.key, ok: true, raw: hit, ms: 0, cached: true });
        else queue.push(r);
      }
      const worker = async () => {
        for (let r = queue.shift(); r; r = queue.shift()) finish(await runOne(r, dir, opts));
      };
      await Promise.all(Array.from({ length: Math.min(limit, queue.length) }, worker));
      return reqs.map((r) => outcomes.get(r.key)!);
    },
  };
}

async function runOne(r: SimRequest, dir: string, opts: LocalExecutorOptions): Promise<SimOutcome> {
  const t0 = performance.now();
  try {
    const run = await runNgspiceAsync(r.deck, { timeoutMs: opts.timeoutMs, circuitOffset: r.circuitOffset, circuit: r.circuit });
    if (!opts.noCache) writeCached(dir, r.key, run.raw);
    return { key: r.key, ok: true, raw: run.raw, ms: round(performance.now() - t0), cached: false };
  } catch (e) {
    const line = e instanceof SpiceError ? e.line : undefined;
    return { key: r.key, ok: false, error: (e as Error).message, ...(line !== undefined ? { line } : {}), ms: round(performance.now() - t0) };
  }
}

const round = (ms: number) => Math.round(ms * 10) / 10;
