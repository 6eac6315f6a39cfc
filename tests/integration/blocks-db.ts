// Each blocks-/runs-/reviews- test file gets a database of its own in the test cluster, with every migration
// applied: other suites start workers that serve every team, and these files need to know exactly which
// worker ran which run. Called from vi.hoisted, before anything reads DATABASE_URL.
import { randomUUID } from "node:crypto";
import pg from "pg";

export async function usePrivateDatabase(): Promise<string> {
  const shared = process.env.DATABASE_URL;
  if (!shared) throw new Error("DATABASE_URL is not set (global-setup provides it)");
  const name = `assay_runs_${randomUUID().slice(0, 8)}`;
  const admin = new pg.Client({ connectionString: shared });
  await admin.connect();
  try {
    await admin.query(`create database ${name}`);
  } finally {
    await admin.end();
  }
  const url = new URL(shared);
  url.pathname = `/${name}`;
  process.env.DATABASE_URL = url.toString();
  const { migrateUp } = await import("@/lib/db/migrate");
  await migrateUp();
  return process.env.DATABASE_URL;
}
