import { execFileSync } from "node:child_process";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";

await vi.hoisted(async () => { await (await import("./blocks-db")).usePrivateDatabase(); });
import { CheckRunSchema } from "@/entities";
import { anonymous } from "@/lib/auth/caller";
import { createBlock } from "@/lib/blocks/create";
import { getBlock } from "@/lib/blocks/read";
import { contextFor } from "@/lib/context";
import { closeOrm, getEm } from "@/lib/db/orm";
import type { AppError } from "@/lib/errors";
import { cancelDraftRun, getDraftRun, startDraftRun, type DraftRunView } from "@/lib/runs/draft-runs";
import { contentBlock, drain, makeTeam, type TestTeam } from "./blocks-helpers";

// The live preview's "simulate" button, through its service: a draft of the demo Wien-bridge oscillator is
// simulated in this process, nothing is stored, and a cancel kills its ngspice processes.

let team: TestTeam;
const wien = () => `wien-draft-${team.tag}`;

beforeAll(async () => {
  team = await makeTeam();
  await createBlock(await contextFor(team.author), { team: team.slug, text: contentBlock("wien-bridge-sine-1k.md", wien()) });
  await drain(team);
}, 600_000);
afterAll(async () => {
  await closeOrm();
});

const ctxOf = async (who: keyof Omit<TestTeam, "slug" | "id" | "tag">) => contextFor(team[who]);
const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

async function until(id: string, ok: (v: DraftRunView) => boolean, ms = 300_000): Promise<DraftRunView> {
  const ctx = await ctxOf("viewer");
  const end = Date.now() + ms;
  for (;;) {
    const v = await getDraftRun(ctx, { id });
    if (ok(v)) return v;
    if (Date.now() > end) throw new Error(`draft run ${id} still ${v.status} (${v.progress.done}/${v.progress.total})`);
    await sleep(100);
  }
}

/** ngspice processes this test process started (prlimit execs ngspice, so each is a direct child). */
// A draft's simulations run as `ngspice -b` (alone or a batch). The `ngspice -p` processes a worker slot keeps between
// jobs belong to the simulate loop that verifying the demo block in this process started, not to any draft.
const ngspiceChildren = () =>
  execFileSync("ps", ["-o", "pid=,args=", "--ppid", String(process.pid)], { encoding: "utf8" }).split("\n")
    .filter((l) => /ngspice|prlimit/.test(l) && !/ngspice -p\b/.test(l));

async function storedState() {
  const head = await getBlock(await ctxOf("viewer"), { slug: wien() });
  const em = await getEm();
  const runs = await em.count(CheckRunSchema, { version: { block: { slug: wien() } } });
  return { version: head.version, badge: head.badge, runs };
}

describe("draft runs", () => {
  it("simulates a draft with changed values and stores nothing", async () => {
    const before = await storedState();
    expect(before.badge).toBe("verified");
    // C from 10 nF to 12 nF: f0 = 1/(2 pi R C) = 839.4 Hz (Wien bridge, Sedra & Smith, Microelectronic Circuits,
    // 7th ed., from memory), 16 % below the 1 kHz the expression check allows 8 % around.
    const started = await startDraftRun(await ctxOf("viewer"), { slug: wien(), params: { C: "12 nF" } });
    expect(["queued", "running"]).toContain(started.status);
    const v = await until(started.id, (r) => r.status !== "queued" && r.status !== "running");
    expect(v.status).toBe("done");
    const report = v.report!;
    expect(v.progress.total).toBeGreaterThan(1); // nominal and at least one tolerance corner
    expect(v.progress.done).toBe(v.progress.total);
    const f0 = report.checks.find((c) => c.label.startsWith("f0 within"))!;
    expect(f0.status).toBe("fail");
    const osc = report.checks.find((c) => c.label === "oscillates near f0")!;
    expect(osc.simulated).toBe(true);
    expect(osc.status).not.toBe("skipped");
    expect(["corners", "worst-case"]).toContain(osc.over);
    // The simulated frequency follows the draft's C, not the stored 10 nF (1007 Hz).
    expect(osc.compared!.value).toBeGreaterThan(839.4 * 0.97);
    expect(osc.compared!.value).toBeLessThan(839.4 * 1.03);
    expect(report.simulations.length).toBeGreaterThan(0);
    expect(report.checks.filter((c) => c.simulated).every((c) => c.status !== "skipped")).toBe(true);
    // Nothing a draft simulates changes the stored block: same head, same badge, no new check run.
    expect(await storedState()).toEqual(before);
  }, 400_000);

  it("cancels a running draft: its ngspice processes end and no report comes", async () => {
    // An edited file of the block asking for 150 Monte Carlo samples (minutes of simulation here), with values
    // nobody simulated before, so neither the end of the work nor the simulation cache can answer before the cancel.
    const rf1 = `${(18 + Math.random()).toFixed(4)} kohm`;
    const text = contentBlock("wien-bridge-sine-1k.md", wien(), { Rf1: rf1 }).replace("```check\n", "```check\nmontecarlo(150)\n");
    const ctx = await ctxOf("viewer");
    const started = await startDraftRun(ctx, { slug: wien(), text });
    await until(started.id, (r) => r.status === "running" && r.progress.total > 0, 60_000);
    await until(started.id, () => ngspiceChildren().length > 0, 30_000);
    const cancelled = await cancelDraftRun(ctx, { id: started.id });
    expect(cancelled.status).toBe("cancelled");
    expect(cancelled.report).toBeNull();
    expect(cancelled.progress.done).toBeLessThan(cancelled.progress.total);
    expect(ngspiceChildren()).toEqual([]);
    await sleep(1500);
    const later = await getDraftRun(ctx, { id: started.id });
    expect(later.status).toBe("cancelled");
    expect(later.report).toBeNull();
    expect(later.progress).toEqual(cancelled.progress);
    expect(ngspiceChildren()).toEqual([]);
  }, 120_000);

  it("keeps one draft run per person: a new one replaces the running one", async () => {
    const ctx = await ctxOf("author");
    const first = await startDraftRun(ctx, { slug: wien(), params: { Rf1: `${(18 + Math.random()).toFixed(4)} kohm` } });
    const second = await startDraftRun(ctx, { slug: wien(), params: { Rf1: `${(18 + Math.random()).toFixed(4)} kohm` } });
    const old = await getDraftRun(ctx, { id: first.id });
    expect(old.status).toBe("cancelled");
    expect(old.error).toMatch(/replaced/);
    expect((await cancelDraftRun(ctx, { id: second.id })).status).toBe("cancelled");
  }, 60_000);

  it("answers only its starter, and only callers who may read the block", async () => {
    const mine = await startDraftRun(await ctxOf("viewer"), { slug: wien(), params: { Rf1: "18.5 kohm" } });
    const code = (p: Promise<unknown>) => p.then(() => "ok", (e: AppError) => e.code);
    expect(await code(getDraftRun(await ctxOf("author"), { id: mine.id }))).toBe("not_found");
    expect(await code(cancelDraftRun(await ctxOf("author"), { id: mine.id }))).toBe("not_found");
    expect(await code(startDraftRun(await ctxOf("outsider"), { slug: wien() }))).toBe("not_found");
    expect(await code(startDraftRun(await contextFor(anonymous), { slug: wien() }))).toBe("unauthenticated");
    expect((await cancelDraftRun(await ctxOf("viewer"), { id: mine.id })).status).toBe("cancelled");
  }, 60_000);

  it("refuses an edited file that names another block", async () => {
    const other = contentBlock("wien-bridge-sine-1k.md", `${wien()}-other`);
    const refused = await startDraftRun(await ctxOf("author"), { slug: wien(), text: other }).then(() => null, (e: AppError) => e);
    expect(refused?.code).toBe("validation");
    expect(refused?.message).toContain(`not ${wien()}`);
  }, 60_000);
});
