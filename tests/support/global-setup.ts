import type { TestProject } from "vitest/node";
import { startCluster, type Cluster } from "./pg-cluster";

// Once per vitest run: a fresh database with every migration applied; removed at the end, pass or fail.
let cluster: Cluster | undefined;

export default async function setup(project: TestProject) {
  const env: Record<string, string> = {};
  if (process.env.ASSAY_TEST_DATABASE_URL) {
    env.DATABASE_URL = process.env.ASSAY_TEST_DATABASE_URL;
  } else {
    cluster = await startCluster();
    env.DATABASE_URL = cluster.url;
  }
  process.env.DATABASE_URL = env.DATABASE_URL;
  const { migrateUp } = await import("../../lib/db/migrate");
  const { closeOrm } = await import("../../lib/db/orm");
  await migrateUp();
  await closeOrm();
  project.provide("assayEnv", env);
  return async () => {
    cluster?.stop();
  };
}

declare module "vitest" {
  export interface ProvidedContext {
    assayEnv: Record<string, string>;
  }
}
