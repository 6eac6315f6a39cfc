import { spawn, type ChildProcess } from "node:child_process";
import { mkdtempSync, rmSync } from "node:fs";
import os from "node:os";
import path from "node:path";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";

await vi.hoisted(async () => { await (await import("./blocks-db")).usePrivateDatabase(); });
import { CheckRunSchema, OutboxEventSchema } from "@/entities";
import { createBlock } from "@/lib/blocks/create";
import { getBlock } from "@/lib/blocks/read";
import { getRun } from "@/lib/runs/runs";
import { closeOrm, getEm } from "@/lib/db/orm";
import { workerHealth } from "@/lib/runs/worker-health";
import { makeTeam, wienFixture, type TestTeam } from "./blocks-helpers";
import { withParams } from "@/checks";
import { contextFor } from "@/lib/context";

// Real worker processes (scripts/worker.ts) on this file's team only, with a 3 s lease so a dead worker's run
// comes back quickly, and a private simulation cache so every run really simulates.
let team: TestTeam;
const cache = mkdtempSync(path.join(os.tmpdir(), "assay-sim-cache-"));
const children: ChildProcess[] = [];
beforeAll(async () => { team = await makeTeam(); });
afterAll(async () => {
  for (const c of children) if (c.exitCode === null && c.signalCode === null) try { process.kill(-c.pid!, "SIGKILL"); } catch { /* gone */ }
  rmSync(cache, { recursive: true, force: true });
  await closeOrm();
});

function startWorker(id: string): { child: ChildProcess; lines: string[]; ready: Promise<void> } {
  const child = spawn(process.execPath, ["--import", "tsx", "scripts/worker.ts", "--team", team.slug], {
    cwd: process.cwd(), detached: true, stdio: ["ignore", "pipe", "pipe"],
    env: { ...process.env, ASSAY_WORKER_ID: id, ASSAY_RUN_LEASE_SECONDS: "3", ASSAY_SIM_CACHE: cache },
  });
  children.push(child);
  const lines: string[] = [];
  const ready = new Promise<void>((resolve, reject) => {
    child.stdout!.on("data", (d: Buffer) => {
      lines.push(...d.toString().split("\n").filter(Boolean));
      if (lines.some((l) => l.endsWith("ready"))) resolve();
    });
    child.stderr!.on("data", (d: Buffer) => lines.push(d.toString()));
    child.once("exit", (code) => reject(new Error(`worker ${id} exited (${code}): ${lines.join("\n")}`)));
  });
  return { child, lines, ready };
}

async function until<T>(what: string, fn: () => Promise<T | null | undefined | false>, ms = 60_000): Promise<T> {
  const end = Date.now() + ms;
  for (;;) {
    const v = await fn();
    if (v) return v;
    if (Date.now() > end) throw new Error(`timed out waiting for ${what}`);
    await new Promise((r) => setTimeout(r, 25));
  }
}

const runRow = async (id: string) => (await getEm()).findOneOrFail(CheckRunSchema, { id });

describe("worker processes", () => {
  it("a run whose worker is killed mid-run is finished by another worker, exactly once", { timeout: 120_000 }, async () => {
    const a = startWorker(`kill-a-${team.tag}`);
    await a.ready;
    const slug = `kill-${team.tag}`;
    const { run } = await createBlock(await contextFor(team.author), { team: team.slug, text: withParams(wienFixture(slug), { Rf: "22.3 kohm" }) });
    await until("worker a to lease the run", async () => {
      const r = await runRow(run.id);
      return r.status === "running" && r.leasedBy === `kill-a-${team.tag}`;
    }, 30_000);
    process.kill(-a.child.pid!, "SIGKILL");
    await new Promise((r) => a.child.once("exit", r));
    const orphan = await runRow(run.id);
    expect(orphan.status).toBe("running");
    expect(orphan.attempts).toBe(1);

    const b = startWorker(`kill-b-${team.tag}`);
    await b.ready;
    const done = await until("the run to finish", async () => {
      const r = await runRow(run.id);
      return r.status === "done" || r.status === "error" ? r : null;
    });
    expect(done.status).toBe("done");
    expect(done.attempts).toBe(2);
    expect(done.leasedBy).toBeNull();
    expect((done.report as { status: string }).status).toBe("verified");
    // Progress counts the run's simulations; once done, every one of them (the report lists each).
    const sims = (done.report as { simulations: unknown[] }).simulations.length;
    expect(sims).toBeGreaterThan(0);
    expect((await getRun(await contextFor(team.viewer), { id: run.id })).progress).toEqual({ done: sims, total: sims });
    expect((await getBlock(await contextFor(team.viewer), { slug })).badge).toBe("verified");
    const finished = await (await getEm()).find(OutboxEventSchema, { kind: "run.finished", payload: { runId: run.id } } as never);
    expect(finished).toHaveLength(1);
    expect(b.lines.filter((l) => l.includes(`run ${run.id}: done`))).toHaveLength(1);
    expect(await workerHealth()).toBe("ok");
    process.kill(-b.child.pid!, "SIGTERM");
    await new Promise((r) => b.child.once("exit", r));
  });

  it("two workers verify a queue concurrently, each run once", { timeout: 120_000 }, async () => {
    const c = startWorker(`pair-c-${team.tag}`);
    const d = startWorker(`pair-d-${team.tag}`);
    await Promise.all([c.ready, d.ready]);
    const runs: string[] = [];
    for (let i = 0; i < 6; i++) {
      const slug = `pair-${i}-${team.tag}`;
      const r = await createBlock(await contextFor(team.author), { team: team.slug, text: withParams(wienFixture(slug), { Rf: `${22 + i * 0.1} kohm` }) });
      runs.push(r.run.id);
    }
    await until("all six runs", async () => {
      const rows = await (await getEm()).find(CheckRunSchema, { id: { $in: runs } });
      return rows.every((r) => r.status === "done") ? rows : null;
    });
    // The row turns done before the worker's log line crosses the pipe: wait for every line too.
    const doneBy = (w: typeof c, id: string) => w.lines.some((l) => l.includes(`run ${id}: done`));
    await until("every run's line in a worker's log", async () => runs.every((id) => doneBy(c, id) || doneBy(d, id)), 10_000);
    const byC = runs.filter((id) => doneBy(c, id));
    const byD = runs.filter((id) => doneBy(d, id));
    expect(byC.length).toBeGreaterThan(0);
    expect(byD.length).toBeGreaterThan(0);
    expect([...byC, ...byD].sort()).toEqual([...runs].sort());
    const rows = await (await getEm()).find(CheckRunSchema, { id: { $in: runs } });
    expect(rows.every((r) => r.attempts === 1)).toBe(true);
    for (const w of [c, d]) process.kill(-w.child.pid!, "SIGTERM");
    await Promise.all([c, d].map((w) => new Promise((r) => w.child.once("exit", r))));
  });
});
