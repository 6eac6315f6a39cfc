import { spawn } from "node:child_process";
import { startApp, startWorker, type AppServer } from "./app-server";

// The whole product for browser tests: demo data, a check worker, the outbox consumers and the built app,
// against the database, search server and mail sink that global-setup started for this run.
export interface Stack {
  app: AppServer;
  stop: () => Promise<void>;
}

function runScript(script: string): Promise<void> {
  return new Promise((resolve, reject) => {
    const child = spawn("node", ["--import", "tsx", script], { env: process.env, stdio: ["ignore", "pipe", "pipe"] });
    let out = "";
    child.stdout.on("data", (b) => (out += b));
    child.stderr.on("data", (b) => (out += b));
    child.on("exit", (code) => (code === 0 ? resolve() : reject(new Error(`${script} exited ${code}:\n${out}`))));
  });
}

function startConsumers() {
  const child = spawn("node", ["--import", "tsx", "scripts/consumers.ts"], { env: process.env, stdio: "ignore", detached: true });
  return async () => {
    if (child.exitCode !== null) return;
    const exited = new Promise<void>((r) => child.once("exit", () => r()));
    process.kill(-child.pid!, "SIGTERM");
    await exited;
  };
}

export async function startStack(): Promise<Stack> {
  await runScript("scripts/seed.ts");
  const worker = startWorker();
  const stopConsumers = startConsumers();
  const app = await startApp();
  return {
    app,
    stop: async () => {
      await app.stop();
      await worker.stop();
      await stopConsumers();
    },
  };
}

/** Wait until the outbox is drained into search, so seeded blocks can be found. */
export async function waitForIndex(app: AppServer, timeoutMs = 120_000): Promise<void> {
  const until = Date.now() + timeoutMs;
  while (Date.now() < until) {
    const h = (await (await fetch(`${app.url}/api/v1/health`)).json()) as { indexBacklog: number };
    if (h.indexBacklog === 0) return;
    await new Promise((r) => setTimeout(r, 500));
  }
  throw new Error("search index did not catch up");
}
