// Runs the parts npm start needs and restarts one that exits, with a growing pause, instead of stopping them all.
// Usage: node --import tsx scripts/supervise.ts NAME "COMMAND" [NAME "COMMAND" ...]
// Only SIGINT/SIGTERM stop the whole. Each part's state goes to ASSAY_PARTS_FILE for the health route.
import { spawn, type ChildProcess } from "node:child_process";
import { renameSync, writeFileSync } from "node:fs";
import { backoffMs, type PartState } from "../lib/health/parts";

const STEADY_MS = 60_000; // a part that stayed up this long starts its backoff afresh
const STOP_GRACE_MS = 10_000;

interface Part { name: string; command: string; child?: ChildProcess; restarts: number; startedAt: number; state: PartState }

const stateFile = process.env.ASSAY_PARTS_FILE;
const args = process.argv.slice(2);
const parts: Part[] = [];
for (let i = 0; i + 1 < args.length; i += 2) {
  parts.push({ name: args[i], command: args[i + 1], restarts: 0, startedAt: 0, state: { status: "starting", restarts: 0 } });
}
let stopping = false;
const log = (line: string) => console.log(`[assay] ${line}`);

function writeState() {
  if (!stateFile) return;
  const all = Object.fromEntries(parts.map((p) => [p.name, p.state]));
  writeFileSync(`${stateFile}.tmp`, JSON.stringify(all));
  renameSync(`${stateFile}.tmp`, stateFile); // readers never see half a file
}

function start(part: Part) {
  // exec: the part's own PID is the child's, so a signal reaches it and not a shell around it
  const child = spawn("bash", ["-c", `exec ${part.command}`], { stdio: "inherit", env: process.env });
  part.child = child;
  part.startedAt = Date.now();
  part.state = { status: "up", pid: child.pid, restarts: part.restarts, since: new Date().toISOString() };
  writeState();
  child.on("exit", (code, signal) => {
    part.child = undefined;
    if (stopping) return;
    if (Date.now() - part.startedAt > STEADY_MS) part.restarts = 0;
    const wait = backoffMs(part.restarts);
    part.restarts += 1;
    const how = signal ? `signal ${signal}` : `code ${code}`;
    log(`${part.name} exited (${how}); restarting in ${wait / 1000} s (restart ${part.restarts})`);
    part.state = { status: "down", exit: how, restarts: part.restarts, since: new Date().toISOString(), retryAt: new Date(Date.now() + wait).toISOString() };
    writeState();
    // The pause also lets a Ctrl-C that reached the part first reach us too before anything restarts.
    setTimeout(() => { if (!stopping) start(part); }, wait);
  });
}

function stopAll() {
  if (stopping) return;
  stopping = true;
  const alive = parts.filter((p) => p.child);
  for (const p of alive) p.child!.kill("SIGTERM");
  const force = setTimeout(() => { for (const p of parts) p.child?.kill("SIGKILL"); }, STOP_GRACE_MS);
  void Promise.all(alive.map((p) => new Promise((r) => (p.child ? p.child.once("exit", r) : r(null))))).then(() => {
    clearTimeout(force);
    process.exit(0);
  });
}

process.on("SIGINT", stopAll);
process.on("SIGTERM", stopAll);
for (const p of parts) start(p);
