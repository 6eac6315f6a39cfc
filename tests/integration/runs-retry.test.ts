import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";

await vi.hoisted(async () => { await (await import("./blocks-db")).usePrivateDatabase(); });

// Short lease and engine time limit for this file only (each test file runs in its own process).
vi.hoisted(() => {
  process.env.ASSAY_RUN_LEASE_SECONDS = "1";
  process.env.ASSAY_RUN_TIMEOUT_MS = "40";
  process.env.ASSAY_SIM_CACHE = require("node:fs").mkdtempSync(require("node:path").join(require("node:os").tmpdir(), "assay-retry-cache-"));
});

import { CheckRunSchema, OutboxEventSchema } from "@/entities";
import { createBlock } from "@/lib/blocks/create";
import { getBlock } from "@/lib/blocks/read";
import { closeOrm, getEm } from "@/lib/db/orm";
import { processNext } from "@/lib/runs/execute";
import { claimRun, MAX_ATTEMPTS, reapExpired } from "@/lib/runs/lease";
import { makeTeam, wienFixture, type TestTeam } from "./blocks-helpers";
import { contextFor } from "@/lib/context";

let team: TestTeam;
beforeAll(async () => { team = await makeTeam(); });
afterAll(closeOrm);
const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));
const runRow = async (id: string) => (await getEm()).findOneOrFail(CheckRunSchema, { id });

describe("bounded retries", () => {
  it("a run whose workers keep dying is retried up to the limit, then ends as error with the reason", async () => {
    expect(MAX_ATTEMPTS).toBe(3);
    const slug = `ghost-${team.tag}`;
    const { run } = await createBlock(await contextFor(team.author), { team: team.slug, text: wienFixture(slug) });
    // Three workers each lease the run and vanish without renewing or finishing.
    for (let i = 1; i <= MAX_ATTEMPTS; i++) {
      const claimed = await claimRun(await getEm(), `ghost-${i}`);
      expect(claimed?.id).toBe(run.id);
      expect(claimed?.attempts).toBe(i);
      expect(await claimRun(await getEm(), `rival-${i}`)).toBeNull(); // leased: nobody else
      await sleep(1200);
    }
    expect(await claimRun(await getEm(), "ghost-4")).toBeNull(); // attempts used up
    expect(await reapExpired(await getEm())).toBeGreaterThanOrEqual(1);
    const r = await runRow(run.id);
    expect(r.status).toBe("error");
    expect(r.error).toMatch(/stopped responding on each of 3 attempts/);
    expect((await getBlock(await contextFor(team.viewer), { slug })).badge).toBe("error");
    const ev = await (await getEm()).find(OutboxEventSchema, { kind: "run.finished", payload: { runId: run.id } } as never);
    expect(ev).toHaveLength(1);
    expect(ev[0].payload).toMatchObject({ badge: "error", status: "error" });
  });

  it("an engine time-out is retried, then the run ends as error naming the time limit", async () => {
    const slug = `slow-${team.tag}`;
    const { run } = await createBlock(await contextFor(team.author), { team: team.slug, text: wienFixture(slug) });
    const outcomes: string[] = [];
    for (let i = 0; i < MAX_ATTEMPTS + 1; i++) outcomes.push((await processNext(`slow-worker`)).outcome);
    expect(outcomes).toEqual(["retry", "retry", "error", "idle"]);
    const r = await runRow(run.id);
    expect(r).toMatchObject({ status: "error", attempts: 3 });
    expect(r.error).toMatch(/attempt 3 failed: the check run took longer than 40 ms/);
  });
});
