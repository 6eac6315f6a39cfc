import { mkdtempSync, rmSync } from "node:fs";
import os from "node:os";
import path from "node:path";
import { randomBytes } from "node:crypto";
import type { TestProject } from "vitest/node";
import { freePort, startCluster, type Cluster } from "./pg-cluster";

// Once per vitest run: a fresh database with every migration applied, a search server and a mail sink of the
// run's own, on free ports; all removed at the end, pass or fail.
const cleanups: (() => unknown)[] = [];

export default async function setup(project: TestProject) {
  const env: Record<string, string> = {};
  if (process.env.ASSAY_TEST_DATABASE_URL) {
    env.DATABASE_URL = process.env.ASSAY_TEST_DATABASE_URL;
  } else {
    const cluster: Cluster = await startCluster();
    cleanups.push(() => cluster.stop());
    env.DATABASE_URL = cluster.url;
  }
  const tmp = mkdtempSync(path.join(os.tmpdir(), "assay-test-"));
  cleanups.push(() => rmSync(tmp, { recursive: true, force: true }));

  // A real Meilisearch named by MEILI_URL is used as it is; otherwise our local server.
  if (process.env.MEILI_URL) {
    env.MEILI_URL = process.env.MEILI_URL;
    env.MEILI_MASTER_KEY = process.env.MEILI_MASTER_KEY ?? "";
    env.ASSAY_SEARCH_INDEX = `blocks-test-${randomBytes(3).toString("hex")}`;
  } else {
    const { startSearchServer } = await import("../../lib/search/server/index");
    const key = randomBytes(16).toString("hex");
    const search = await startSearchServer({ port: 0, key, dir: path.join(tmp, "search") });
    cleanups.push(() => search.close());
    env.MEILI_URL = search.url;
    env.MEILI_MASTER_KEY = key;
  }

  const { startMailSink } = await import("../../lib/mail/sink");
  const mailDir = path.join(tmp, "mail");
  const sink = await startMailSink({ port: await freePort(), dir: mailDir });
  cleanups.push(() => sink.close());
  env.SMTP_URL = `smtp://127.0.0.1:${sink.port}`;
  env.ASSAY_MAIL_SINK_DIR = mailDir;
  env.NEXTAUTH_SECRET = randomBytes(32).toString("hex");
  env.APP_URL ??= "http://127.0.0.1:3999";

  Object.assign(process.env, env);
  const { migrateUp } = await import("../../lib/db/migrate");
  const { closeOrm } = await import("../../lib/db/orm");
  await migrateUp();
  await closeOrm();
  project.provide("assayEnv", env);
  return async () => {
    for (const c of cleanups.reverse()) await c();
  };
}

declare module "vitest" {
  export interface ProvidedContext {
    assayEnv: Record<string, string>;
  }
}
