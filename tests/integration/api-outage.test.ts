import { spawnSync } from "node:child_process";
import { afterAll, describe, expect, it } from "vitest";
import { startApp, type AppServer } from "../support/app-server";
import { freePort, startCluster, type Cluster } from "../support/pg-cluster";

// A part the app depends on going away is a 503 problem document with Retry-After (RFC 9110 §15.6.4 and
// §10.2.3), not a 500: the request may well succeed in a few seconds.
const stops: (() => unknown)[] = [];
afterAll(async () => { for (const s of stops.reverse()) await s(); });

async function expectUnavailable(res: Response, part: string) {
  expect(res.status).toBe(503);
  expect(res.headers.get("content-type")).toBe("application/problem+json");
  expect(Number(res.headers.get("retry-after"))).toBeGreaterThan(0);
  const body = (await res.json()) as { type: string; detail: string };
  expect(body.type).toMatch(/\/problems\/unavailable$/);
  expect(body.detail).toContain(part);
}

describe("an outage", () => {
  it("of search answers the search route with 503 and Retry-After", async () => {
    const dead = await freePort(); // nothing listens here
    const app: AppServer = await startApp({ env: { MEILI_URL: `http://127.0.0.1:${dead}` } });
    stops.push(() => app.stop());
    await expectUnavailable(await fetch(`${app.url}/api/v1/blocks?q=limiter`), "search");
  }, 600_000);

  it("of the database under a read answers 503 and Retry-After, and health says so", async () => {
    const cluster: Cluster = await startCluster();
    stops.push(() => { try { cluster.stop(); } catch { /* stopped by the test */ } });
    const migrated = spawnSync("node", ["--import", "tsx", "scripts/migrate.ts"], { env: { ...process.env, DATABASE_URL: cluster.url }, encoding: "utf8" });
    expect(migrated.status, migrated.stderr).toBe(0);
    const app = await startApp({ env: { DATABASE_URL: cluster.url } });
    stops.push(() => app.stop());
    expect((await fetch(`${app.url}/api/v1/blocks/no-such-block`)).status).toBe(404);
    cluster.stop();
    await expectUnavailable(await fetch(`${app.url}/api/v1/blocks/no-such-block`), "database");
    const health = await fetch(`${app.url}/api/v1/health`);
    expect(health.status).toBe(503);
  }, 600_000);
});
