import os from "node:os";
import type { SimExecutor, SimOutcome, SimRequest } from "../engine/executor";
import { BATCH_SIZE, runBatchAsync } from "./batch";
import { readCached, writeCached } from "./cache";
import { defaultCacheDir } from "./paths";
import { runNgspiceAsync } from "./run-ngspice";
import { NgspiceSession } from "./session";
import { SpiceError } from "./types";

export type LocalExecutorOptions = {
  cacheDir?: string;
  noCache?: boolean;
  concurrency?: number;
  timeoutMs?: number;
  /** Aborted: running ngspice processes are killed, nothing new starts, and runMany rejects once they have exited. */
  signal?: AbortSignal;
  /** false: every simulation in a process of its own (bench/tolerance compares the two). */
  batch?: boolean;
  /**
   * Keep ngspice processes between calls (one per concurrency slot) for short analyses, instead of starting one per
   * batch: for a long-lived caller such as a worker's simulation slot, which must call close() when it stops.
   */
  keep?: boolean;
  /** With keep: how long a kept process may sit idle before it ends (KEEP_IDLE_MS). */
  keepIdleMs?: number;
};

// One plot each, so the control block's `write` holds what `ngspice -b -r` would (noise writes two plots).
const BATCHED = new Set(["ac", "op", "dc", "tf"]);
/**
 * Transients share a process too while they are short: the points of a Monte Carlo sample of an oscillator. Starting
 * ngspice from the engine's process costs more than the simulation itself saves there (fork copies the page tables
 * of a large process: 20 ms and more a start), and a batch holds its plots in memory, so long ones run alone.
 */
export const TRAN_BATCH_POINTS = 50_000;

/**
 * Two of the options a circuit may set outlive its `remcirc` in ngspice 39: `interp` (output at the step points only)
 * and `cshunt` (a capacitor from every node to ground) stay in force for every later circuit of the process, and
 * `unset` does not reach them. A circuit setting either never shares a process, so it cannot change another's plot.
 */
const LEAKING_OPTION = /^[ \t]*\.opt(?:ion|ions)?\b[^\n]*\b(?:interp|cshunt)\b/im;

const batchable = (r: SimRequest) => !LEAKING_OPTION.test(r.circuit)
  && (BATCHED.has(r.analysis.kind) || (r.analysis.kind === "tran" && r.analysis.stop / r.analysis.step <= TRAN_BATCH_POINTS));

/** A kept ngspice process idle this long ends: a worker between bursts of simulations holds none. */
export const KEEP_IDLE_MS = 30_000;

/** How many ngspice processes run at once by default: one per core. */
export const defaultConcurrency = () => Math.max(1, os.availableParallelism?.() ?? os.cpus().length);

/**
 * The executor of one machine: the content-addressed cache first, then ngspice processes,
 * up to one per core at a time. Identical requests in one batch run once.
 */
export function localExecutor(opts: LocalExecutorOptions = {}): SimExecutor & { close(): void } {
  const dir = opts.cacheDir ?? defaultCacheDir();
  const limit = Math.max(1, opts.concurrency ?? defaultConcurrency());
  const idle: { session: NgspiceSession; timer: NodeJS.Timeout }[] = []; // kept processes not running a batch now
  const batch = async (job: SimRequest[]) => {
    if (!opts.keep) return runBatchAsync(job.map((r) => r.deck), opts.timeoutMs, opts.signal);
    const kept = idle.pop();
    if (kept) clearTimeout(kept.timer);
    const session = kept?.session ?? new NgspiceSession();
    const raws = await session.run(job.map((r) => r.deck), opts.timeoutMs, opts.signal);
    if (!session.usable) session.close();
    else {
      const timer = setTimeout(() => {
        idle.splice(idle.findIndex((k) => k.session === session), 1);
        session.close();
      }, opts.keepIdleMs ?? KEEP_IDLE_MS).unref();
      idle.push({ session, timer });
    }
    return raws;
  };
  return {
    close: () => idle.splice(0).forEach((k) => {
      clearTimeout(k.timer);
      k.session.close();
    }),
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
      // Long transients and noise run one per process; the rest share a process up to BATCH_SIZE at a time.
      const joins = (r: SimRequest) => opts.batch !== false && batchable(r);
      const jobs: SimRequest[][] = queue.filter((r) => !joins(r)).map((r) => [r]);
      const short = queue.filter(joins);
      const size = Math.max(1, Math.min(BATCH_SIZE, Math.ceil(short.length / limit)));
      for (let i = 0; i < short.length; i += size) jobs.push(short.slice(i, i + size));
      const worker = async () => {
        for (let job = jobs.shift(); job && !opts.signal?.aborted; job = jobs.shift())
          // A kept process runs a lone short analysis too: it costs no start-up there.
          if (job.length === 1 && !(opts.keep && joins(job[0]))) finish(await runOne(job[0], dir, opts));
          else for (const o of await runBatch(job, dir, opts, batch)) finish(o);
      };
      await Promise.all(Array.from({ length: Math.min(limit, jobs.length) }, worker));
      // Cancelled outcomes say nothing about the circuit: the executor cannot go on, which ends the run.
      if (opts.signal?.aborted) throw new Error("the simulations were cancelled");
      return reqs.map((r) => outcomes.get(r.key)!);
    },
  };
}

async function runOne(r: SimRequest, dir: string, opts: LocalExecutorOptions): Promise<SimOutcome> {
  const t0 = performance.now();
  try {
    const run = await runNgspiceAsync(r.deck, { timeoutMs: opts.timeoutMs, circuitOffset: r.circuitOffset, circuit: r.circuit, signal: opts.signal });
    if (!opts.noCache) writeCached(dir, r.key, run.raw);
    return { key: r.key, ok: true, raw: run.raw, ms: round(performance.now() - t0), cached: false };
  } catch (e) {
    const line = e instanceof SpiceError ? e.line : undefined;
    return { key: r.key, ok: false, error: (e as Error).message, ...(line !== undefined ? { line } : {}), ms: round(performance.now() - t0) };
  }
}

async function runBatch(reqs: SimRequest[], dir: string, opts: LocalExecutorOptions, batch: (job: SimRequest[]) => Promise<(Buffer | null)[]>): Promise<SimOutcome[]> {
  const t0 = performance.now();
  const raws = await batch(reqs);
  const each = round((performance.now() - t0) / reqs.length);
  const out: SimOutcome[] = [];
  for (const [i, r] of reqs.entries()) {
    const raw = raws[i];
    if (!raw) {
      if (opts.signal?.aborted) break; // stopped, not failed: nothing to run alone for its message
      out.push(await runOne(r, dir, opts)); // alone, for its own error message
      continue;
    }
    if (!opts.noCache) writeCached(dir, r.key, raw);
    out.push({ key: r.key, ok: true, raw, ms: each, cached: false });
  }
  return out;
}

const round = (ms: number) => Math.round(ms * 10) / 10;
