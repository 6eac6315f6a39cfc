import { spawn } from "node:child_process";
import { randomBytes } from "node:crypto";
import { mkdtempSync, readFileSync, rmSync } from "node:fs";
import os from "node:os";
import path from "node:path";
import pg from "pg";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { ensureBuilt, freePort } from "../support/app-server";

// The real start script: one part that crashes is restarted and reported, the rest keep serving.
// Its own database in the test cluster, so its worker never takes runs of other test files.
const dbName = `assay_start_${randomBytes(4).toString("hex")}`;
const tmp = mkdtempSync(path.join(os.tmpdir(), "assay-start-"));
const partsFile = path.join(tmp, "parts.json");
let out = "";
let start: ReturnType<typeof spawn>;
let url = "";

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));
const parts = () => JSON.parse(readFileSync(partsFile, "utf8")) as Record<string, { status: string; pid?: number }>;
async function health(): Promise<Record<string, unknown> | null> {
  try {
    const res = await fetch(`${url}/api/v1/health`, { signal: AbortSignal.timeout(2000) });
    return (await res.json()) as Record<string, unknown>;
  } catch {
    return null;
  }
}
async function until<T>(what: string, fn: () => Promise<T | null | undefined | false>, ms: number, every = 200): Promise<T> {
  const end = Date.now() + ms;
  while (Date.now() < end) {
    const v = await fn().catch(() => null);
    if (v) return v;
    await sleep(every);
  }
  throw new Error(`${what} not seen within ${ms} ms; start script said:\n${out.slice(-4000)}`);
}

function withDb(name: string): string {
  const u = new URL(process.env.DATABASE_URL!);
  u.pathname = `/${name}`;
  return u.toString();
}

beforeAll(async () => {
  await ensureBuilt();
  const admin = new pg.Client({ connectionString: process.env.DATABASE_URL });
  await admin.connect();
  await admin.query(`create database ${dbName}`);
  await admin.end();
  const port = await freePort();
  url = `http://127.0.0.1:${port}`;
  const env: NodeJS.ProcessEnv = {
    ...process.env, DATABASE_URL: withDb(dbName), PORT: String(port), APP_URL: url, ASSAY_PARTS_FILE: partsFile,
    LOCAL_SEARCH_PORT: String(await freePort()), LOCAL_SMTP_PORT: String(await freePort()),
  };
  delete env.MEILI_URL;
  delete env.SMTP_URL;
  delete env.ASSAY_MAIL_SINK_DIR;
  start = spawn("bash", ["scripts/start.sh"], { env, stdio: ["ignore", "pipe", "pipe"], detached: true });
  start.stdout!.on("data", (b: Buffer) => (out += b.toString()));
  start.stderr!.on("data", (b: Buffer) => (out += b.toString()));
  await until("every part up and the health route answering", async () => {
    const h = await health();
    return h?.worker === "ok" && h.parts && Object.values(h.parts).every((v) => v === "ok") && h;
  }, 240_000, 500);
}, 300_000);

afterAll(async () => {
  if (start && start.exitCode === null) {
    try { process.kill(-start.pid!, "SIGKILL"); } catch { /* gone */ }
  }
  const admin = new pg.Client({ connectionString: process.env.DATABASE_URL });
  await admin.connect();
  await admin.query(`drop database if exists ${dbName} with (force)`);
  await admin.end();
  rmSync(tmp, { recursive: true, force: true });
});

describe("npm start supervises its parts", () => {
  it("restarts a SIGKILLed worker, says it is down meanwhile, and keeps the rest", async () => {
    const before = parts();
    expect(Object.keys(before).sort()).toEqual(["consumers", "mail", "search", "web", "worker"]);
    process.kill(before.worker.pid!, "SIGKILL");
    const down = await until("health naming the worker as down", async () => {
      const h = await health();
      return typeof h?.worker === "string" && /down since/.test(h.worker) && h;
    }, 5000, 50);
    expect((down.parts as Record<string, string>).worker).toMatch(/SIGKILL/);
    expect(out).toMatch(/worker exited \(signal SIGKILL\); restarting in 1 s/);
    const after = await until("a new worker process", async () => {
      const p = parts();
      return p.worker.status === "up" && p.worker.pid !== before.worker.pid && p;
    }, 10_000);
    for (const name of ["web", "search", "mail", "consumers"]) expect(after[name].pid).toBe(before[name].pid);
    await until("health all ok again", async () => {
      const h = await health();
      return h && Object.values(h.parts as object).every((v) => v === "ok") && h;
    }, 30_000, 500);
    expect(start.exitCode).toBeNull();
  }, 60_000);

  it("stops the whole on SIGTERM, and only then", async () => {
    const pids = Object.values(parts()).map((p) => p.pid!);
    const exited = new Promise<number | null>((r) => start.once("exit", (code) => r(code)));
    process.kill(start.pid!, "SIGTERM");
    expect(await exited).toBe(0);
    for (const pid of pids) expect(() => process.kill(pid, 0)).toThrow();
  }, 30_000);
});
