// A throwaway PostgreSQL and local search server for one benchmark run, on free loopback ports,
// removed at the end whatever happens. The app, if a bench needs it, is started against these.
import { randomBytes } from "node:crypto";
import { mkdtempSync, rmSync } from "node:fs";
import os from "node:os";
import path from "node:path";
import { startApp, type AppServer } from "../../tests/support/app-server";
import { startCluster } from "../../tests/support/pg-cluster";

export interface BenchServices {
  env: { DATABASE_URL: string; MEILI_URL: string; MEILI_MASTER_KEY: string };
  /** `next start` against these services (building first if the sources changed); stopped with the rest. */
  startApp: (extraEnv?: Record<string, string>) => Promise<AppServer>;
}

export async function withBenchServices(name: string, fn: (s: BenchServices) => Promise<void>): Promise<void> {
  const cluster = await startCluster();
  const tmp = mkdtempSync(path.join(os.tmpdir(), `assay-bench-${name}-`));
  const key = randomBytes(16).toString("hex");
  Object.assign(process.env, { DATABASE_URL: cluster.url, MEILI_MASTER_KEY: key });
  const { startSearchServer } = await import("../../lib/search/server/index");
  const search = await startSearchServer({ port: 0, key, dir: path.join(tmp, "search") });
  process.env.MEILI_URL = search.url;
  const env = { DATABASE_URL: cluster.url, MEILI_URL: search.url, MEILI_MASTER_KEY: key };
  const apps: AppServer[] = [];
  try {
    const { migrateUp } = await import("../../lib/db/migrate");
    await migrateUp();
    await fn({
      env,
      startApp: async (extraEnv = {}) => {
        const { closeOrm } = await import("../../lib/db/orm");
        await closeOrm();
        const app = await startApp({ env: { ...env, ...extraEnv } });
        apps.push(app);
        return app;
      },
    });
  } finally {
    for (const app of apps) await app.stop();
    await search.close();
    cluster.stop();
    rmSync(tmp, { recursive: true, force: true });
  }
}
