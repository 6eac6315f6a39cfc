import { fork, type ChildProcess } from "node:child_process";
import type { RunProgress, SimExecutor, SimRequest } from "../engine/executor";
import { assayRoot, childCommand } from "./root";

// The child runs scripts from users: give it what it needs to run and no secrets (database URL, keys).
const PASSED_ENV = /^(PATH|HOME|TMPDIR|TMP|TEMP|LANG|LC_ALL|NODE_ENV|TZ|ASSAY_(SIM_CACHE|SIM_CACHE_MB|MODELS_DIR|NGSPICE_CODEMODELS)|SPICE_.*)$/;
function childEnv(root: string): Record<string, string> {
  const env: Record<string, string> = { ASSAY_ROOT: root };
  for (const [k, v] of Object.entries(process.env)) if (PASSED_ENV.test(k) && v !== undefined) env[k] = v;
  return env;
}

type Reply = { id: number; ok: boolean; value?: unknown; error?: string };
/** What the child asks of the parent during a run: simulations, and news of progress. */
type Ask = { id: number; kind: "runMany"; call: number; reqs: SimRequest[] } | { id: number; kind: "progress"; done: number; total: number };
export type RunHooks = { executor?: SimExecutor; progress?: RunProgress };
type Pending = { resolve: (r: Reply) => void; timer: NodeJS.Timeout; timeoutMs: number; hooks?: RunHooks };

/**
 * One warm sandbox child: requests run one at a time; a request that runs past its time
 * or a child that dies (out of memory) gives an error reply, and the next request starts
 * a fresh child. Idle children do not keep the parent process alive.
 */
export class SandboxLane {
  private child: ChildProcess | null = null;
  private ready: Promise<void> | null = null;
  private queue: Promise<unknown> = Promise.resolve();
  private pending = new Map<number, Pending>();
  private nextId = 1;
  private stderr = "";

  constructor(private memoryMb: number) {}

  /** Start the child ahead of the first request (it takes about a second to load). */
  warm(): void {
    if (!this.child) this.start().then(() => this.idle(), () => undefined);
  }

  request(op: string, text: string, opts: unknown, timeoutMs: number, hooks?: RunHooks): Promise<Reply> {
    const run = this.queue.then(() => this.send(op, text, opts, timeoutMs, hooks));
    this.queue = run.catch(() => undefined);
    return run;
  }

  private start(): Promise<void> {
    const root = assayRoot();
    const { entry, execArgv } = childCommand(this.memoryMb);
    // A child being replaced (timed out, or started again before it answered) is ended, never left running.
    if (this.child && this.child.exitCode === null) this.child.kill("SIGKILL");
    const child = fork(entry, [], {
      cwd: root,
      execPath: process.execPath,
      execArgv,
      stdio: ["ignore", "ignore", "pipe", "ipc"],
      env: childEnv(root) as NodeJS.ProcessEnv,
      serialization: "advanced",
    });
    this.child = child;
    this.stderr = "";
    child.stderr?.on("data", (d: Buffer) => (this.stderr = (this.stderr + d.toString()).slice(-4000)));
    this.ready = new Promise((resolve, reject) => {
      const onFirst = (m: Reply) => m.id === 0 && (child.off("message", onFirst), resolve());
      child.on("message", onFirst);
      child.once("exit", (code) => reject(new Error(`the sandbox did not start (exit ${code}): ${this.stderr.trim().split("\n").slice(-3).join(" ")}`)));
    });
    child.on("message", (m: Reply | Ask) => {
      const p = this.pending.get(m.id);
      if (!p) return;
      if ("kind" in m) return this.answer(child, p, m);
      clearTimeout(p.timer);
      this.pending.delete(m.id);
      this.idle();
      p.resolve(m);
    });
    child.on("exit", (code, signal) => {
      if (this.child === child) [this.child, this.ready] = [null, null];
      const oom = /heap out of memory|Reached heap limit|Allocation failed/i.test(this.stderr);
      for (const [id, p] of this.pending) {
        clearTimeout(p.timer);
        const why = oom
          ? `the check script ran out of memory (limit ${this.memoryMb} MB)`
          : `the sandbox stopped (${signal ?? `exit ${code}`})`;
        p.resolve({ id, ok: false, error: why });
      }
      this.pending.clear();
    });
    return this.ready;
  }

  /** Run the child's simulations on the caller's executor and pass its progress on. */
  private answer(child: ChildProcess, p: Pending, m: Ask) {
    if (m.kind === "progress") return p.hooks?.progress?.(m.done, m.total);
    const executor = p.hooks?.executor;
    if (!executor) return child.send({ kind: "outcomes", call: m.call, error: "no executor was given for this run" });
    executor.runMany(m.reqs).then(
      (outcomes) => child.connected && child.send({ kind: "outcomes", call: m.call, outcomes }),
      (e: Error) => child.connected && child.send({ kind: "outcomes", call: m.call, error: e.message }),
    );
  }

  private idle() {
    if (this.pending.size === 0 && this.child) {
      this.child.unref();
      (this.child.channel as unknown as { unref?: () => void } | undefined)?.unref?.();
      (this.child.stderr as unknown as { unref?: () => void } | null)?.unref?.();
    }
  }

  private async send(op: string, text: string, opts: unknown, timeoutMs: number, hooks?: RunHooks): Promise<Reply> {
    if (!this.child || !this.ready) this.start();
    const child = this.child!;
    child.ref();
    (child.channel as unknown as { ref?: () => void } | undefined)?.ref?.();
    try {
      await this.ready;
    } catch (e) {
      return { id: -1, ok: false, error: (e as Error).message };
    }
    const id = this.nextId++;
    return new Promise<Reply>((resolve) => {
      const timer = setTimeout(() => {
        this.pending.delete(id);
        resolve({ id, ok: false, error: `the check run took longer than ${timeoutMs} ms and was stopped` });
        // Forget the child at once: the next request must not reach it while it is dying.
        if (this.child === child) [this.child, this.ready] = [null, null];
        child.kill("SIGKILL");
      }, timeoutMs);
      this.pending.set(id, { resolve, timer, timeoutMs, hooks });
      child.send({ id, op, text, opts });
    });
  }
}

// Previews and full runs get a lane each, so a long simulation never holds up a keystroke. One pair per process:
// Next bundles this module into each route that uses it, and each copy would otherwise start children of its own.
const lanes = globalThis as unknown as { __assayLanes?: { preview: SandboxLane; verify: SandboxLane }; __assayDraftLane?: SandboxLane };
// Heap limits: scripts/engine-build.mjs writes a startup snapshot for each of these (SNAPSHOT_HEAP_MB there).
lanes.__assayLanes ??= { preview: new SandboxLane(256), verify: new SandboxLane(768) };
export const previewLane = lanes.__assayLanes.preview;
export const verifyLane = lanes.__assayLanes.verify;
// Simulations of unsaved drafts (the live preview's button) queue in a lane of their own: one at a time per
// process, never ahead of or behind an evaluation that someone's script is waiting for.
lanes.__assayDraftLane ??= new SandboxLane(768);
export const draftLane = lanes.__assayDraftLane;
