import pg from "pg";
import { afterAll, describe, expect, it } from "vitest";
import { listenFor } from "@/lib/runs/listen";

// The worker's wake-up channel survives losing its connection (what a database restart does to it): the backend
// is terminated from outside (PostgreSQL 15 manual §9.27.2, pg_terminate_backend) and a NOTIFY sent afterwards
// still arrives.
const admin = new pg.Client({ connectionString: process.env.DATABASE_URL });
afterAll(() => admin.end());
const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

describe("LISTEN for queued runs", () => {
  it("is restored after its connection is killed, and a later NOTIFY wakes the listener", async () => {
    await admin.connect();
    const channel = `assay_test_${Date.now()}`;
    let woken = 0;
    const lines: string[] = [];
    const l = listenFor({ channels: [channel], onNotify: () => woken++, log: (line) => lines.push(line) });
    const backend = async () => (await admin.query(`select pid from pg_stat_activity where application_name = $1`, [`assay-listen-${channel}`])).rows;
    for (let i = 0; i < 50 && (await backend()).length === 0; i++) await sleep(100);
    const [{ pid }] = await backend();
    await admin.query("select pg_terminate_backend($1)", [pid]);
    for (let i = 0; i < 100; i++) {
      const rows = await backend();
      if (rows.length === 1 && rows[0].pid !== pid && lines.some((x) => x.includes("restored"))) break;
      await sleep(100);
    }
    expect(lines.join("\n")).toMatch(/lost .*\n.*restored/);
    const before = woken;
    await admin.query(`NOTIFY ${channel}`);
    for (let i = 0; i < 50 && woken === before; i++) await sleep(100);
    expect(woken).toBeGreaterThan(before);
    await l.stop();
  }, 30_000);
});
