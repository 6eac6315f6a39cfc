import type { EntityManager } from "@mikro-orm/postgresql";
import PgBoss from "pg-boss";
import { databaseUrl } from "@/lib/db/database-url";

/** A verification (one check run) and one simulation of it are jobs of their own queues. */
export const VERIFY_QUEUE = "verify";
export const SIMULATE_QUEUE = "simulate";

const holder = globalThis as unknown as { __assayBoss?: PgBoss; __assayBossStart?: Promise<PgBoss> };

/**
 * The process's pg-boss client. Sending needs no start: it runs on the caller's transaction (`inTransaction`).
 * Fetching, completing and failing use pg-boss's own small pool, opened by `startedBoss()`.
 */
export function boss(): PgBoss {
  holder.__assayBoss ??= new PgBoss({
    connectionString: databaseUrl(), max: 3, application_name: "assay-queue",
    // Workers notice a dead peer through their own heartbeats (lib/runs/lease.ts); pg-boss's own expiry is the
    // backstop, so its maintenance may run often and cheaply. Nothing is scheduled by cron.
    schedule: false, maintenanceIntervalSeconds: 10,
    // Jobs are delivery, not the record (check_runs is): finished ones leave the live table after an hour.
    archiveCompletedAfterSeconds: 3600, deleteAfterDays: 1,
  });
  return holder.__assayBoss;
}

export function startedBoss(): Promise<PgBoss> {
  holder.__assayBossStart ??= boss().start().then(async (b) => {
    b.on("error", (err: Error) => console.error(`[queue] ${err.message}`));
    return b;
  }).catch((err) => {
    holder.__assayBossStart = undefined;
    throw err;
  });
  return holder.__assayBossStart;
}

const stopHooks = new Set<() => Promise<void>>();
/** Loops built on the client (a worker's simulate loop) stop before it does. */
export function beforeBossStops(fn: () => Promise<void>): void {
  stopHooks.add(fn);
}

export async function stopBoss(): Promise<void> {
  for (const fn of [...stopHooks]) await fn().catch(() => undefined);
  stopHooks.clear();
  const started = holder.__assayBossStart;
  holder.__assayBossStart = undefined;
  holder.__assayBoss = undefined;
  if (started) await (await started).stop({ graceful: false, wait: true }).catch(() => undefined);
}

/**
 * pg-boss's `db` option over the connection of the EntityManager's open transaction, so a job is sent,
 * fetched or finished in the same commit as the check_runs row it belongs to.
 */
export function inTransaction(em: EntityManager): PgBoss.Db {
  const ctx = em.getTransactionContext() as { client?: { acquireConnection(): Promise<{ query(t: string, v: unknown[]): Promise<{ rows: unknown[] }> }> } } | undefined;
  if (!ctx?.client) throw new Error("a queue operation in a transaction needs an open transaction");
  return {
    executeSql: async (text, values) => {
      const conn = await ctx.client!.acquireConnection();
      const { rows } = await conn.query(text, values ?? []);
      return { rows };
    },
  };
}

/**
 * Installs or upgrades pg-boss's own schema (pg-boss's migrator, under its advisory lock) and our queues.
 * Runs as the last step of `npm run migrate`, so the app can send a job before any worker has started.
 */
export async function installQueues(): Promise<void> {
  const installer = new PgBoss({ connectionString: databaseUrl(), max: 1, supervise: false, schedule: false });
  await installer.start();
  try {
    for (const name of [VERIFY_QUEUE, SIMULATE_QUEUE]) await installer.createQueue(name, { name });
  } finally {
    await installer.stop({ graceful: false, wait: true });
  }
}
