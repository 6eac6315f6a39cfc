import type { EntityManager } from "@mikro-orm/postgresql";
import { cacheIdentity, defaultCacheDir, localExecutor, readCached, type SimExecutor, type SimOutcome, type SimRequest } from "@/checks";
import { getEm } from "@/lib/db/orm";
import { SIMULATE_QUEUE, startedBoss } from "@/lib/queue/boss";
import { SIM_CHANNEL, SIM_EXPIRE_SECONDS, SIM_MAX_ATTEMPTS, simJobId, type SimJobData } from "./sim-jobs";

type Row = { key: string; ok: boolean; raw: Buffer | null; raw_in_cache: boolean; error: string | null; line: number | null; ms: number; cached: boolean };
const POLL_MS = 250; // a fallback: a worker's NOTIFY listener wakes the waiting coordinator as each result lands

const waiters = new Map<string, () => void>();
/** A result of this run was stored (NOTIFY from the worker that ran it): look now instead of at the next poll. */
export function resultArrived(runId: string): void {
  waiters.get(runId)?.();
}
const nap = (runId: string, ms: number) => new Promise<void>((resolve) => {
  const t = setTimeout(done, ms);
  function done() { clearTimeout(t); waiters.delete(runId); resolve(); }
  waiters.set(runId, done);
});

/**
 * The executor a worker hands the engine for one attempt of a run: every simulation becomes a `simulate` job that
 * any worker may run, and outcomes come back through sim_results (keyed by run and request hash). Outcomes an
 * earlier attempt of the run already brought back are used as they are. `close()` ends the waiting and cancels
 * the jobs nobody has finished, whether the run ended or its attempt was given up.
 */
export function queueExecutor(
  run: { id: string; attempt: number },
  // Simulations finished over every batch so far, and where the current batch ends: what the engine would count.
  onProgress?: (done: number, total: number) => void,
): SimExecutor & { failure: Error | null; close(): Promise<void> } {
  let closed = false;
  let base = 0; // requests of the batches already answered
  const open = new Set<string>(); // job ids not yet answered
  const keys = new Set<string>(); // every request this attempt asked for
  const self = {
    failure: null as Error | null,
    runMany: (reqs: SimRequest[], progress?: (done: number, total: number) => void) =>
      runAll(reqs, progress).catch((err: Error) => {
        self.failure ??= err; // the attempt fails on this, whatever the engine makes of the rejection
        throw err;
      }),
    async close() {
      closed = true;
      // Also the jobs an earlier attempt left behind (its worker died): nobody needs their answers any more.
      const earlier = [...keys].flatMap((k) => Array.from({ length: run.attempt - 1 }, (_, i) => simJobId(run.id, i + 1, k)));
      const ids = [...open, ...earlier];
      if (ids.length) await (await startedBoss()).cancel(SIMULATE_QUEUE, ids).catch(() => undefined);
      open.clear();
    },
  };
  return self;

  async function runAll(reqs: SimRequest[], progress?: (done: number, total: number) => void): Promise<SimOutcome[]> {
    const unique = new Map(reqs.map((r) => [r.key, r]));
    for (const k of unique.keys()) keys.add(k);
    const outcomes = new Map<string, SimOutcome>();
    let done = 0;
    const take = (o: SimOutcome) => {
      if (outcomes.has(o.key)) return;
      outcomes.set(o.key, o);
      open.delete(simJobId(run.id, run.attempt, o.key));
      done += reqs.filter((q) => q.key === o.key).length;
      progress?.(done, reqs.length);
      onProgress?.(base + done, base + reqs.length);
    };
    const takeRows = async (rows: Row[]) => {
      const pruned: SimRequest[] = [];
      for (const r of rows) {
        const o = outcome(r);
        if (o) take(o);
        else pruned.push(unique.get(r.key)!);
      }
      // A raw file left in the cache was pruned before it was read (a cache far smaller than one run): simulate again here.
      if (pruned.length) (await localExecutor({ concurrency: 1 }).runMany(pruned)).forEach(take);
    };
    await takeRows(await results(run.id, [...unique.keys()]));
    const waiting = [...unique.values()].filter((r) => !outcomes.has(r.key));
    await send(run, waiting, open);
    for (let round = 0; outcomes.size < unique.size; round++) {
      if (closed) throw new Error("the run's simulations were abandoned");
      await nap(run.id, POLL_MS);
      await takeRows(await results(run.id, waiting.filter((r) => !outcomes.has(r.key)).map((r) => r.key)));
      if (round % 10 === 9 && outcomes.size < unique.size) await assertNoneLost(run, waiting.filter((r) => !outcomes.has(r.key)));
    }
    base += reqs.length;
    return reqs.map((r) => outcomes.get(r.key)!);
  }
}

/** A stored outcome as the engine takes it; null when its raw file was left in our cache and is no longer there. */
function outcome(r: Row): SimOutcome | null {
  if (!r.ok) return { key: r.key, ok: false, error: r.error ?? "the simulation failed", ...(r.line != null ? { line: r.line } : {}), ms: r.ms };
  const raw = r.raw_in_cache ? readCached(defaultCacheDir(), r.key) : r.raw;
  return raw ? { key: r.key, ok: true, raw, ms: r.ms, cached: r.cached } : null;
}

async function send(run: { id: string; attempt: number }, reqs: SimRequest[], open: Set<string>): Promise<void> {
  if (reqs.length === 0) return;
  const cache = cacheIdentity(defaultCacheDir());
  const jobs = reqs.map((request) => {
    const id = simJobId(run.id, run.attempt, request.key);
    open.add(id);
    return { id, name: SIMULATE_QUEUE, data: { runId: run.id, request, cache } satisfies SimJobData, retryLimit: SIM_MAX_ATTEMPTS - 1, expireInSeconds: SIM_EXPIRE_SECONDS };
  });
  await (await startedBoss()).insert(jobs);
  await (await getEm()).getConnection().execute(`select pg_notify('${SIM_CHANNEL}', '')`);
}

async function results(runId: string, keys: string[]): Promise<Row[]> {
  if (keys.length === 0) return [];
  const em: EntityManager = await getEm();
  return em.getConnection().execute<Row[]>(
    `select key, ok, raw, raw_in_cache, error, line, ms, cached from sim_results where run_id = ? and key in (${keys.map(() => "?").join(",")})`,
    [runId, ...keys]);
}

/** A job pg-boss gave up on (its worker died on every attempt) will never answer: this attempt of the run cannot go on. */
async function assertNoneLost(run: { id: string; attempt: number }, waiting: SimRequest[]): Promise<void> {
  const ids = waiting.map((r) => simJobId(run.id, run.attempt, r.key));
  // pg-boss has no call that reads many jobs' states at once; its job table is read by queue name and id.
  const em = await getEm();
  const lost = await em.getConnection().execute<{ n: string }[]>(
    `select count(*) as n from pgboss.job where name = ? and id in (${ids.map(() => "?").join(",")}) and state = 'failed'`,
    [SIMULATE_QUEUE, ...ids]);
  if (Number(lost[0].n) > 0) {
    throw new Error(`${lost[0].n} simulation(s) were lost: their worker stopped responding on each of ${SIM_MAX_ATTEMPTS} attempts`);
  }
}
