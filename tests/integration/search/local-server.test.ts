import { spawn } from "node:child_process";
import { mkdirSync, mkdtempSync, readdirSync, readFileSync, rmSync, statSync, writeFileSync } from "node:fs";
import { createServer } from "node:net";
import { tmpdir } from "node:os";
import path from "node:path";
import { afterEach, describe, expect, it } from "vitest";
import { Meilisearch } from "meilisearch";
import { startSearchServer } from "@/lib/search/server";
import { ensureMasterKey } from "@/lib/search/server/key";
import { newTask } from "@/lib/search/server/tasks";
import { blockDocs, blockSettings } from "./fixtures";

// What only the local stand-in promises beyond the shared contract: its index
// survives a restart on the same directory, its CLI start-up, and its key file.
const dirs: string[] = [];
const tempDir = () => {
  const d = mkdtempSync(path.join(tmpdir(), "assay-search-local-"));
  dirs.push(d);
  return d;
};
afterEach(() => {
  for (const d of dirs.splice(0)) rmSync(d, { recursive: true, force: true });
});

describe("local search server", () => {
  it("keeps documents, settings and task numbers across a restart", async () => {
    const dir = tempDir();
    const first = await startSearchServer({ port: 0, key: "k1", dir });
    let client = new Meilisearch({ host: first.url, apiKey: "k1" });
    await client.createIndex("blocks", { primaryKey: "id" }).waitTask();
    await client.index("blocks").updateSettings(blockSettings).waitTask();
    const added = await client.index("blocks").addDocuments(blockDocs).waitTask();
    await client.index("blocks").deleteDocument(6).waitTask();
    await first.close();

    const second = await startSearchServer({ port: 0, key: "k1", dir });
    client = new Meilisearch({ host: second.url, apiKey: "k1" });
    try {
      expect(await client.index("blocks").getDocument(3)).toEqual(blockDocs[2]);
      expect((await client.index("blocks").getDocuments({ limit: 100 })).total).toBe(5);
      expect((await client.index("blocks").getSettings()).searchableAttributes).toEqual(blockSettings.searchableAttributes);
      const res = await client.index("blocks").search("oscilator", { filter: "approved = true" });
      expect(res.hits.map((h) => h.id)).toEqual([1]);
      expect((await client.tasks.getTask(added.uid)).status).toBe("succeeded");
      const next = await client.index("blocks").addDocuments([{ id: 7, title: "Twin-T notch" }]).waitTask();
      expect(next.uid).toBeGreaterThan(added.uid);
    } finally {
      await second.close();
    }
  });

  it("runs the tasks it had accepted but not run when it stopped", async () => {
    const dir = tempDir();
    const first = await startSearchServer({ port: 0, key: "k2", dir });
    await new Meilisearch({ host: first.url, apiKey: "k2" }).createIndex("blocks", { primaryKey: "id" }).waitTask();
    await first.close();
    // What an accepted, unprocessed addition leaves on disk (queue/<taskUid>.json).
    mkdirSync(path.join(dir, "queue"), { recursive: true });
    const task = newTask(1, "blocks", "documentAdditionOrUpdate", { receivedDocuments: 2, indexedDocuments: null });
    writeFileSync(path.join(dir, "queue", "1.json"), JSON.stringify({ task, payload: { kind: "addDocuments", documents: blockDocs.slice(0, 2), mode: "replace" } }));
    const second = await startSearchServer({ port: 0, key: "k2", dir });
    try {
      const client = new Meilisearch({ host: second.url, apiKey: "k2" });
      expect(await client.tasks.waitForTask(1)).toMatchObject({ status: "succeeded", details: { indexedDocuments: 2 } });
      expect((await client.index("blocks").getDocuments()).total).toBe(2);
      expect(readdirSync(path.join(dir, "queue"))).toEqual([]);
    } finally {
      await second.close();
    }
  });

  it("prints its address at start and exits 1 with one line when the port is taken", async () => {
    const dir = tempDir();
    const run = (port: number) =>
      new Promise<{ code: number | null; out: string; err: string; kill: () => void }>((resolve) => {
        const child = spawn(process.execPath, ["--import", "tsx", "lib/search/server/main.ts"], {
          env: { ...process.env, LOCAL_SEARCH_PORT: String(port), LOCAL_SEARCH_DIR: dir, MEILI_MASTER_KEY: "cli-key" },
        });
        let out = "";
        let err = "";
        child.stdout.on("data", (b) => {
          out += b;
          if (out.includes("listening")) resolve({ code: null, out, err, kill: () => child.kill("SIGTERM") });
        });
        child.stderr.on("data", (b) => (err += b));
        child.on("exit", (code) => resolve({ code, out, err, kill: () => {} }));
      });

    const holder = createServer();
    await new Promise<void>((r) => holder.listen(0, "127.0.0.1", () => r()));
    const port = (holder.address() as { port: number }).port;
    const busy = await run(port);
    expect(busy.code).toBe(1);
    expect(busy.err.trim().split("\n")).toHaveLength(1);
    expect(busy.err).toContain(`port ${port}`);
    expect(busy.err).toContain("already in use");
    await new Promise<void>((r) => holder.close(() => r()));

    const ok = await run(port);
    try {
      expect(ok.out.trim()).toBe(`search server listening on http://127.0.0.1:${port}`);
      expect(await new Meilisearch({ host: `http://127.0.0.1:${port}`, apiKey: "cli-key" }).getIndexes()).toMatchObject({ total: 0 });
    } finally {
      ok.kill();
    }
  });

  it("makes a master key once and keeps it, unless MEILI_MASTER_KEY is set", () => {
    const dir = tempDir();
    const saved = process.env.MEILI_MASTER_KEY;
    delete process.env.MEILI_MASTER_KEY;
    try {
      const key = ensureMasterKey(dir);
      expect(key.length).toBeGreaterThanOrEqual(32);
      expect(ensureMasterKey(dir)).toBe(key);
      expect(readFileSync(path.join(dir, "search-key"), "utf8").trim()).toBe(key);
      expect(statSync(path.join(dir, "search-key")).mode & 0o077).toBe(0);
      process.env.MEILI_MASTER_KEY = "from-env";
      expect(ensureMasterKey(dir)).toBe("from-env");
    } finally {
      if (saved === undefined) delete process.env.MEILI_MASTER_KEY;
      else process.env.MEILI_MASTER_KEY = saved;
    }
  });
});
