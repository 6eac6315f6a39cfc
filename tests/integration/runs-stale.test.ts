import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";

await vi.hoisted(async () => { await (await import("./blocks-db")).usePrivateDatabase(); });

// This file's engine reads a private copy of the model library, so changing it touches nobody else.
const dirs = vi.hoisted(() => {
  const fs = require("node:fs") as typeof import("node:fs");
  const path = require("node:path") as typeof import("node:path");
  const os = require("node:os") as typeof import("node:os");
  const models = fs.mkdtempSync(path.join(os.tmpdir(), "assay-models-"));
  fs.cpSync(path.resolve("content/models"), models, { recursive: true });
  const cache = fs.mkdtempSync(path.join(os.tmpdir(), "assay-stale-cache-"));
  process.env.ASSAY_MODELS_DIR = models;
  process.env.ASSAY_SIM_CACHE = cache;
  return { models, cache };
});

import { execFileSync, spawn } from "node:child_process";
import { appendFileSync, rmSync } from "node:fs";
import path from "node:path";
import { ENGINE_VERSION, modelLibraryHash } from "@/checks";
import { CheckRunSchema } from "@/entities";
import { createBlock } from "@/lib/blocks/create";
import { getBlock } from "@/lib/blocks/read";
import { closeOrm, getEm } from "@/lib/db/orm";
import { enqueueStaleHeads } from "@/lib/runs/reverify";
import { dividerBlock, drain, makeTeam, wienFixture, type TestTeam } from "./blocks-helpers";
import { contextFor } from "@/lib/context";

let team: TestTeam;
beforeAll(async () => { team = await makeTeam(); });
afterAll(async () => {
  await closeOrm();
  rmSync(dirs.models, { recursive: true, force: true });
  rmSync(dirs.cache, { recursive: true, force: true });
});

describe("a model-library change", () => {
  it("makes every head stale; reverify queues them and fresh runs give fresh badges", { timeout: 120_000 }, async () => {
    const wien = `stale-wien-${team.tag}`;
    const div = `stale-div-${team.tag}`;
    await createBlock(await contextFor(team.author), { team: team.slug, text: wienFixture(wien) });
    await createBlock(await contextFor(team.author), { team: team.slug, text: dividerBlock(div) });
    await drain(team);
    const before = modelLibraryHash();
    expect((await getBlock(await contextFor(team.viewer), { slug: wien })).badge).toBe("verified");
    expect((await getBlock(await contextFor(team.viewer), { slug: div })).badge).toBe("verified");
    expect((await enqueueStaleHeads(await getEm(), { teamIds: [team.id] })).queued).toBe(0);

    // A revision of a shared model (here only its comment) is a new library.
    appendFileSync(path.join(dirs.models, "opamp-1pole.lib"), "* revised by the bench team\n");
    const after = modelLibraryHash();
    expect(after).not.toBe(before);
    expect((await getBlock(await contextFor(team.viewer), { slug: wien })).badge).toBe("stale");
    expect((await getBlock(await contextFor(team.viewer), { slug: div })).badge).toBe("stale");

    // npm run reverify, as a process of its own, limited to this team.
    const out = execFileSync(process.execPath, ["--import", "tsx", "scripts/reverify.ts", "--team", team.slug], { env: process.env, encoding: "utf8" });
    expect(out).toMatch(/queued 2 head version\(s\)/);
    expect((await getBlock(await contextFor(team.viewer), { slug: wien })).badge).toBe("pending");
    expect(await drain(team)).toBe(2);
    for (const slug of [wien, div]) {
      const b = await getBlock(await contextFor(team.viewer), { slug });
      expect(b.badge).toBe("verified");
      const run = await (await getEm()).findOneOrFail(CheckRunSchema, { id: b.runId! });
      expect(run).toMatchObject({ modelLibraryHash: after, trigger: "reverify" });
    }
    expect((await enqueueStaleHeads(await getEm(), { teamIds: [team.id] })).queued).toBe(0);

    // Another revision; this time a worker process notices by itself when it starts.
    appendFileSync(path.join(dirs.models, "diode-si.lib"), "* revised again\n");
    const third = modelLibraryHash();
    expect((await getBlock(await contextFor(team.viewer), { slug: div })).badge).toBe("stale");
    const worker = spawn(process.execPath, ["--import", "tsx", "scripts/worker.ts", "--team", team.slug], {
      env: { ...process.env, ASSAY_WORKER_ID: `stale-${team.tag}` }, stdio: ["ignore", "pipe", "pipe"], detached: true,
    });
    let log = "";
    worker.stdout!.on("data", (d: Buffer) => (log += d.toString()));
    try {
      const end = Date.now() + 60_000;
      while (Date.now() < end) {
        const badges = await Promise.all([wien, div].map(async (s) => (await getBlock(await contextFor(team.viewer), { slug: s })).badge));
        if (badges.every((b) => b === "verified")) break;
        await new Promise((r) => setTimeout(r, 100));
      }
      expect(log).toMatch(/queued 2 stale or unchecked head\(s\)/);
      for (const slug of [wien, div]) {
        const b = await getBlock(await contextFor(team.viewer), { slug });
        expect(b.badge).toBe("verified");
        expect((await (await getEm()).findOneOrFail(CheckRunSchema, { id: b.runId! })).modelLibraryHash).toBe(third);
      }
    } finally {
      process.kill(-worker.pid!, "SIGTERM");
      await new Promise((r) => worker.once("exit", r));
    }
  });

  it("a run made by an older engine version is stale too, and reverify replaces it", async () => {
    const slug = `old-engine-${team.tag}`;
    const { run } = await createBlock(await contextFor(team.author), { team: team.slug, text: dividerBlock(slug) });
    await drain(team);
    expect((await getBlock(await contextFor(team.viewer), { slug })).badge).toBe("verified");
    // As if an earlier engine release had made this run (the row is what a previous deployment left).
    await (await getEm()).getConnection().execute(`update check_runs set engine_version = '0.9.0' where id = ?`, [run.id]);
    expect((await getBlock(await contextFor(team.viewer), { slug })).badge).toBe("stale");
    expect((await enqueueStaleHeads(await getEm(), { teamIds: [team.id] })).slugs).toEqual([slug]);
    await drain(team);
    const b = await getBlock(await contextFor(team.viewer), { slug });
    expect(b.badge).toBe("verified");
    expect((await (await getEm()).findOneOrFail(CheckRunSchema, { id: b.runId! })).engineVersion).toBe(ENGINE_VERSION);
  });
});
