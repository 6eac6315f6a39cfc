import { spawn, type ChildProcess } from "node:child_process";
import { randomBytes } from "node:crypto";
import { existsSync } from "node:fs";
import net from "node:net";
import os from "node:os";
import path from "node:path";

// The built app on a free loopback port, for tests that speak HTTP to it.
// `next build` runs only when .next/BUILD_ID is older than a source file. One lock file serialises it across
// test files, test runs and helpers sharing the tree: builds take it exclusively, running servers hold it shared,
// so a build never swaps .next under a server that is answering requests.

// Tests, benches and npm scripts all run from the repository root.
const ROOT = process.cwd();
const LOCK = path.join(os.tmpdir(), `assay-next-build-${Buffer.from(ROOT).toString("hex").slice(-24)}.lock`);
const SOURCES = ["app", "lib", "components", "checks", "entities", "migrations", "next.config.ts", "package.json", "tsconfig.json", "postcss.config.mjs"];
const BUILD_WAIT_S = 900;

export interface AppServer {
  url: string;
  port: number;
  stop: () => Promise<void>;
  /** The last lines the server printed, for failure messages. */
  logs: () => string;
}

export async function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const srv = net.createServer();
    srv.once("error", reject);
    srv.listen(0, "127.0.0.1", () => {
      const { port } = srv.address() as net.AddressInfo;
      srv.close(() => resolve(port));
    });
  });
}

let built: Promise<void> | undefined;

/** Builds once per process, and only when a source is newer than the last build (checked inside the lock). */
export function ensureBuilt(): Promise<void> {
  built ??= new Promise<void>((resolve, reject) => {
    const sources = SOURCES.filter((s) => existsSync(path.join(ROOT, s))).join(" ");
    const stale = `[ ! -f .next/BUILD_ID ] || [ -n "$(find ${sources} -newer .next/BUILD_ID -type f -print -quit 2>/dev/null)" ]`;
    const child = spawn("flock", ["-x", "-w", String(BUILD_WAIT_S), LOCK, "sh", "-c", `if ${stale}; then node node_modules/next/dist/bin/next build; fi`], {
      cwd: ROOT,
      env: { ...process.env, NEXT_TELEMETRY_DISABLED: "1" },
      stdio: ["ignore", "pipe", "pipe"],
    });
    let out = "";
    const keep = (b: Buffer) => (out = (out + b.toString()).slice(-20_000));
    child.stdout!.on("data", keep);
    child.stderr!.on("data", keep);
    child.on("error", reject);
    child.on("exit", (code) => (code === 0 ? resolve() : reject(new Error(`next build failed (exit ${code}):\n${out}`))));
  });
  return built;
}

async function waitForHealth(url: string, child: ChildProcess, logs: () => string, timeoutMs = 90_000): Promise<void> {
  const until = Date.now() + timeoutMs;
  while (Date.now() < until) {
    if (child.exitCode !== null) throw new Error(`next start exited with ${child.exitCode}:\n${logs()}`);
    try {
      const res = await fetch(`${url}/api/v1/health`, { signal: AbortSignal.timeout(2_000) });
      if (res.status === 200) return;
    } catch {
      // not listening yet
    }
    await new Promise((r) => setTimeout(r, 250));
  }
  throw new Error(`the app did not answer /api/v1/health within ${timeoutMs} ms:\n${logs()}`);
}

function spawnGroup(cmd: string, args: string[], env: NodeJS.ProcessEnv) {
  // Its own process group, so stop() ends flock and the server it started together, by that group's id only.
  const child = spawn(cmd, args, { cwd: ROOT, env, stdio: ["ignore", "pipe", "pipe"], detached: true });
  let out = "";
  const keep = (b: Buffer) => (out = (out + b.toString()).slice(-20_000));
  child.stdout!.on("data", keep);
  child.stderr!.on("data", keep);
  const stop = async () => {
    if (child.exitCode !== null || child.signalCode !== null) return;
    const exited = new Promise<void>((r) => child.once("exit", () => r()));
    try {
      process.kill(-child.pid!, "SIGTERM");
    } catch {
      return;
    }
    const timer = setTimeout(() => {
      try {
        process.kill(-child.pid!, "SIGKILL");
      } catch {
        // already gone
      }
    }, 5_000);
    await exited;
    clearTimeout(timer);
  };
  return { child, stop, logs: () => out };
}

/**
 * Starts `next start` on 127.0.0.1 and a free port with the test database (DATABASE_URL from the test env unless
 * `env` overrides it). Give the calling hook a long timeout: the first call may build (1–2 minutes).
 */
export async function startApp(opts: { env?: Record<string, string> } = {}): Promise<AppServer> {
  await ensureBuilt();
  const port = await freePort();
  const url = `http://127.0.0.1:${port}`;
  const env: NodeJS.ProcessEnv = {
    ...process.env,
    NODE_ENV: "production",
    NEXT_TELEMETRY_DISABLED: "1",
    NEXTAUTH_SECRET: process.env.NEXTAUTH_SECRET ?? randomBytes(32).toString("base64url"),
    APP_URL: url,
    NEXTAUTH_URL: url,
    PORT: String(port),
    ...opts.env,
  };
  const server = spawnGroup(
    "flock",
    ["-s", "-w", String(BUILD_WAIT_S), LOCK, "node", "node_modules/next/dist/bin/next", "start", "-H", "127.0.0.1", "-p", String(port)],
    env,
  );
  try {
    await waitForHealth(url, server.child, server.logs);
  } catch (err) {
    await server.stop();
    throw err;
  }
  return { url, port, stop: server.stop, logs: server.logs };
}

/** A check-run worker (scripts/worker.ts) against the same database, for tests that wait for a run to finish. */
export function startWorker(opts: { env?: Record<string, string> } = {}): { stop: () => Promise<void>; logs: () => string } {
  const w = spawnGroup("node", ["--import", "tsx", "scripts/worker.ts"], { ...process.env, ...opts.env });
  return { stop: w.stop, logs: w.logs };
}
