import { spawn } from "node:child_process";
import type { TestProject } from "vitest/node";
import { startApp, startWorker, type AppServer } from "../support/app-server";

// Runs after tests/support/global-setup.ts, which put DATABASE_URL, MEILI_URL and SMTP_URL into process.env.
// Adds the demo data, a check-run worker, the outbox consumers (search index, mail) and the built app.
function run(cmd: string, args: string[]): Promise<string> {
  return new Promise((resolve, reject) => {
    const child = spawn(cmd, args, { env: process.env, stdio: ["ignore", "pipe", "pipe"] });
    let out = "";
    child.stdout.on("data", (b) => (out += b));
    child.stderr.on("data", (b) => (out += b));
    child.on("exit", (code) => (code === 0 ? resolve(out) : reject(new Error(`${cmd} ${args.join(" ")} exited ${code}:\n${out}`))));
  });
}

function startConsumers() {
  const child = spawn("node", ["--import", "tsx", "scripts/consumers.ts"], { env: process.env, stdio: ["ignore", "pipe", "pipe"], detached: true });
  let out = "";
  child.stdout!.on("data", (b) => (out = (out + b).slice(-10_000)));
  child.stderr!.on("data", (b) => (out = (out + b).slice(-10_000)));
  return {
    logs: () => out,
    stop: () => new Promise<void>((resolve) => {
      if (child.exitCode !== null) return resolve();
      child.once("exit", () => resolve());
      process.kill(-child.pid!, "SIGTERM");
    }),
  };
}

export default async function setup(project: TestProject) {
  await run("node", ["--import", "tsx", "scripts/seed.ts"]);
  const worker = startWorker();
  const consumers = startConsumers();
  let app: AppServer | undefined;
  try {
    app = await startApp();
  } catch (err) {
    await Promise.all([worker.stop(), consumers.stop()]);
    throw err;
  }
  project.provide("appUrl", app.url);
  return async () => {
    await app?.stop();
    await Promise.all([worker.stop(), consumers.stop()]);
  };
}

declare module "vitest" {
  export interface ProvidedContext {
    appUrl: string;
  }
}
