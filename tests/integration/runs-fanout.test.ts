import { spawn, type ChildProcess } from "node:child_process";
import { existsSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import os from "node:os";
import path from "node:path";
import { afterAll, afterEach, beforeAll, describe, expect, it, vi } from "vitest";

await vi.hoisted(async () => { await (await import("./blocks-db")).usePrivateDatabase(); });
import { CheckRunSchema, OutboxEventSchema } from "@/entities";
import { createBlock } from "@/lib/blocks/create";
import { contextFor } from "@/lib/context";
import { closeOrm, getEm } from "@/lib/db/orm";
import { SIMULATE_QUEUE, startedBoss } from "@/lib/queue/boss";
import { getRun } from "@/lib/runs/runs";
import { localExecutor, verifyBlock, type Report } from "@/checks";
import { parseRawFile } from "@/checks/spice/raw-file";
import { simRequest } from "@/checks/spice/request";
import { makeTeam, wienFixture, type TestTeam } from "./blocks-helpers";

// Real worker processes sharing one verification's simulations through the `simulate` queue. A 3 s run lease and
// a 4 s simulation expiry make a killed worker's share come back quickly; a private cache makes every run simulate.
let team: TestTeam;
const cache = mkdtempSync(path.join(os.tmpdir(), "assay-fanout-cache-"));
const children: ChildProcess[] = [];
beforeAll(async () => { team = await makeTeam(); });
// Each test's workers stop with it, passed or failed, so the next test's runs go to its own workers.
afterEach(async () => {
  await Promise.all(children.splice(0).filter((c) => c.exitCode === null && c.signalCode === null).map((c) => {
    process.kill(-c.pid!, "SIGTERM");
    return new Promise((r) => c.once("exit", r));
  }));
});
afterAll(async () => {
  for (const c of children) if (c.exitCode === null && c.signalCode === null) try { process.kill(-c.pid!, "SIGKILL"); } catch { /* gone */ }
  rmSync(cache, { recursive: true, force: true });
  await closeOrm();
});

function startWorker(id: string, env: Record<string, string> = {}) {
  const child = spawn(process.execPath, ["--import", "tsx", "scripts/worker.ts"], {
    cwd: process.cwd(), detached: true, stdio: ["ignore", "pipe", "pipe"],
    env: { ...process.env, ASSAY_WORKER_ID: id, ASSAY_RUN_LEASE_SECONDS: "3", ASSAY_SIM_EXPIRE_SECONDS: "4", ASSAY_SIM_CACHE: cache, ...env },
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
  const stop = async () => {
    if (child.exitCode !== null || child.signalCode !== null) return;
    process.kill(-child.pid!, "SIGTERM");
    await new Promise((r) => child.once("exit", r));
  };
  return { id, child, lines, ready, stop };
}

async function until<T>(what: string, fn: () => Promise<T | null | undefined | false>, ms = 90_000): Promise<T> {
  const end = Date.now() + ms;
  for (;;) {
    const v = await fn();
    if (v) return v;
    if (Date.now() > end) throw new Error(`timed out waiting for ${what}`);
    await new Promise((r) => setTimeout(r, 50));
  }
}

const sql = async <T>(text: string, params: unknown[] = []) => (await getEm()).getConnection().execute<T[]>(text, params);
const results = (runId: string) => sql<{ key: string; worker_id: string; ok: boolean; cached: boolean; raw_in_cache: boolean; in_table: boolean }>(
  `select key, worker_id, ok, cached, raw_in_cache, raw is not null as in_table from sim_results where run_id = ?`, [runId]);
/** simulate jobs of the run that pg-boss still holds as waiting or active */
const openJobs = async (runId: string) => Number((await sql<{ n: string }>(
  `select count(*) as n from pgboss.job where name = 'simulate' and data->>'runId' = ? and state in ('created', 'retry', 'active')`, [runId]))[0].n);
const finished = async (runId: string) => {
  const r = await (await getEm()).findOneOrFail(CheckRunSchema, { id: runId });
  return r.status === "done" || r.status === "error" ? r : null;
};

// The test's own Wien-bridge fixture with a finer, longer transient, so each of its simulations takes a while
// (four toleranced parameters: nominal plus corners or worst cases, all of them simulated).
const slowWien = (slug: string) => wienFixture(slug).replace("res = tran(20 ms, 10 us)", "res = tran(40 ms, 1 us)");

describe("one verification spread over two workers", () => {
  it("both workers run its simulations, progress advances to the total, and cache hits stay hits", { timeout: 180_000 }, async () => {
    const c = startWorker(`share-c-${team.tag}`);
    const d = startWorker(`share-d-${team.tag}`);
    await Promise.all([c.ready, d.ready]);
    const slug = `share-${team.tag}`;
    const { run } = await createBlock(await contextFor(team.author), { team: team.slug, text: slowWien(slug) });
    const seen: { done: number; total: number }[] = [];
    const done = await until("the run to finish", async () => {
      seen.push((await getRun(await contextFor(team.viewer), { id: run.id })).progress);
      return finished(run.id);
    });
    expect(done.status).toBe("done");
    const rows = await results(run.id);
    const simulations = (done.report as { simulations: unknown[] }).simulations.length;
    expect(new Set(rows.map((r) => r.key)).size).toBe(rows.length);
    expect(rows.length).toBeGreaterThan(4);
    expect(rows.every((r) => r.ok && !r.cached)).toBe(true);
    expect(new Set(rows.map((r) => r.worker_id))).toEqual(new Set([`share-c-${team.tag}`, `share-d-${team.tag}`]));
    // Both workers see the coordinator's cache (one machine): the raw files passed through it, not the table.
    expect(rows.every((r) => r.raw_in_cache && !r.in_table)).toBe(true);
    // Progress: never goes back, was seen part-way, and ends at its total, which covers every simulation reported.
    const final = (await getRun(await contextFor(team.viewer), { id: run.id })).progress;
    expect(final.done).toBe(final.total);
    expect(final.total).toBeGreaterThanOrEqual(simulations);
    expect(seen.some((p) => p.done > 0 && p.done < p.total)).toBe(true);
    for (let i = 1; i < seen.length; i++) expect(seen[i].done).toBeGreaterThanOrEqual(seen[i - 1].done);
    expect(await openJobs(run.id)).toBe(0);

    // The same decks again (a new version of the same file): every simulation is a hit of the machine's cache.
    const again = await createBlock(await contextFor(team.author), { team: team.slug, text: slowWien(slug).replace(`slug: ${slug}`, `slug: ${slug}-again`) });
    const second = await until("the second run", () => finished(again.run.id));
    expect(second.status).toBe("done");
    const hits = await results(again.run.id);
    expect(hits.length).toBe(rows.length);
    expect(hits.every((r) => r.cached)).toBe(true);
    await Promise.all([c.stop(), d.stop()]);
  });

  it("a worker SIGKILLed mid-verification: the run still ends once, with every simulation accounted for", { timeout: 180_000 }, async () => {
    const workers = [startWorker(`kill-a-${team.tag}`), startWorker(`kill-b-${team.tag}`)];
    await Promise.all(workers.map((w) => w.ready));
    const slug = `kill-fan-${team.tag}`;
    // Sixteen Monte Carlo samples on top of the corners, so that plenty are still to come when the coordinator dies
    // (with the corners alone, the last ones could finish between the look and the kill).
    const text = slowWien(slug).replace("```check\n", "```check\nmontecarlo(16)\n");
    expect(text).toContain("montecarlo(16)");
    const { run } = await createBlock(await contextFor(team.author), { team: team.slug, text });
    // Kill the coordinating worker once both have brought simulations back and several are still to come.
    const coordinator = await until("both workers to have simulated", async () => {
      const rows = await results(run.id);
      const row = await (await getEm()).findOneOrFail(CheckRunSchema, { id: run.id });
      return new Set(rows.map((r) => r.worker_id)).size === 2 && (await openJobs(run.id)) >= 6 && row.leasedBy;
    });
    const a = workers.find((w) => w.id === coordinator)!;
    const b = workers.find((w) => w !== a)!;
    process.kill(-a.child.pid!, "SIGKILL");
    await new Promise((r) => a.child.once("exit", r));
    const before = (await results(run.id)).length;

    const done = await until("the run to finish", () => finished(run.id));
    expect(done.status).toBe("done");
    expect(done.attempts).toBe(2);
    expect((done.report as { status: string }).status).toMatch(/verified|failing/);
    const rows = await results(run.id);
    expect(rows.length).toBeGreaterThan(before); // the rest came from worker b, the earlier ones were kept
    expect(rows.every((r) => r.ok)).toBe(true);
    const progress = (await getRun(await contextFor(team.viewer), { id: run.id })).progress;
    expect(progress.done).toBe(progress.total);
    expect(progress.total).toBeGreaterThanOrEqual((done.report as { simulations: unknown[] }).simulations.length);
    const events = await (await getEm()).find(OutboxEventSchema, { kind: "run.finished", payload: { runId: run.id } } as never);
    expect(events).toHaveLength(1);
    expect(b.lines.filter((l) => l.includes(`run ${run.id}: done`))).toHaveLength(1);
    await until("no simulation of the run left waiting or active", async () => (await openJobs(run.id)) === 0, 30_000);
    await b.stop();
  });

  it("a worker that does not see the coordinator's cache stores the raw file in the table; one that does leaves it there", { timeout: 120_000 }, async () => {
    const w = startWorker(`spool-${team.tag}`);
    await w.ready;
    // A run row for the results to belong to (its own verification is not what this looks at).
    const { run } = await createBlock(await contextFor(team.author), { team: team.slug, text: wienFixture(`spool-${team.tag}`) });
    await until("the run to finish", () => finished(run.id));
    const elsewhere = mkdtempSync(path.join(os.tmpdir(), "assay-other-cache-"));
    try {
      writeFileSync(path.join(elsewhere, ".id"), "a cache on another machine");
      const request = (R: number) => simRequest({ title: "rc", params: { R }, analysis: { kind: "tran", stop: 1e-3, step: 1e-6 }, circuit: "V1 in 0 PULSE(0 1 0 1u 1u 1 2)\nR1 in out {R}\nC1 out 0 100n" });
      const unseen = request(1.1e3); // the id in the job is not the one in that folder: as from another machine
      const seen = request(1.2e3); // the worker's own cache, named as the coordinator names it
      await (await startedBoss()).insert([
        { name: SIMULATE_QUEUE, data: { runId: run.id, request: unseen, cache: { dir: elsewhere, id: "another id" } } },
        { name: SIMULATE_QUEUE, data: { runId: run.id, request: seen, cache: { dir: cache, id: readFileSync(path.join(cache, ".id"), "utf8") } } },
      ]);
      const row = (key: string) => until(`the result of ${key}`, async () =>
        (await sql<{ ok: boolean; raw: Buffer | null; raw_in_cache: boolean }>(`select ok, raw, raw_in_cache from sim_results where run_id = ? and key = ?`, [run.id, key]))[0]);
      const a = await row(unseen.key);
      expect(a.ok && !a.raw_in_cache).toBe(true);
      // The table's copy is ngspice's own raw file for that deck: the capacitor charges towards 1 V.
      const [plot] = parseRawFile(a.raw!);
      expect(plot.real[plot.variables.find((v) => v.name === "v(out)")!.index].at(-1)).toBeCloseTo(1 - Math.exp(-1e-3 / (1.1e3 * 100e-9)), 3);
      const b = await row(seen.key);
      expect(b.ok && b.raw_in_cache && b.raw === null).toBe(true);
      expect(existsSync(path.join(cache, seen.key.slice(0, 2), `${seen.key}.raw`))).toBe(true);
    } finally {
      rmSync(elsewhere, { recursive: true, force: true });
    }
    await w.stop();
  });

  it("a cache too small to keep a raw file until the coordinator reads it: the run simulates it again and ends as usual", { timeout: 120_000 }, async () => {
    // 0.05 MB: each write prunes the cache below one raw file, so every file is gone before the coordinator looks.
    const w = startWorker(`tiny-${team.tag}`, { ASSAY_SIM_CACHE_MB: "0.05" });
    await w.ready;
    const { run } = await createBlock(await contextFor(team.author), { team: team.slug, text: wienFixture(`tiny-${team.tag}`) });
    const done = await until("the run to finish", () => finished(run.id));
    expect(done.status).toBe("done");
    const rows = await results(run.id);
    expect(rows.length).toBeGreaterThan(0);
    expect(rows.every((r) => r.ok && r.raw_in_cache)).toBe(true);
    // The same verdicts and values as the engine gives in this process with ngspice run here and nothing cached.
    const checks = (r: unknown) => (r as Report).checks.map((c) => [c.label, c.status, c.detail, c.compared?.value]);
    const { report } = await verifyBlock(wienFixture(`tiny-${team.tag}`), { executor: localExecutor({ noCache: true }) });
    expect(report.status).toBe("verified");
    expect(checks(done.report)).toEqual(checks(report));
    await w.stop();
  });

  it("a run over the instance's cap ends with the error naming the cap, before anything is simulated", { timeout: 120_000 }, async () => {
    const w = startWorker(`cap-${team.tag}`, { ASSAY_RUN_MAX_SIMULATIONS: "3" });
    await w.ready;
    const { run } = await createBlock(await contextFor(team.author), { team: team.slug, text: slowWien(`cap-${team.tag}`) });
    const done = await until("the run to finish", () => finished(run.id));
    const report = done.report as { status: string; errors: { message: string }[] };
    expect(report.status).toBe("error");
    expect(report.errors.map((e) => e.message).join(" ")).toMatch(/at most 3 simulations.*ASSAY_RUN_MAX_SIMULATIONS/);
    expect(await results(run.id)).toHaveLength(0);
    expect(Number((await sql<{ n: string }>(`select count(*) as n from pgboss.job where name = 'simulate' and data->>'runId' = ?`, [run.id]))[0].n)).toBe(0);
    await w.stop();
  });
});
