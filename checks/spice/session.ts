import { spawn, type ChildProcess } from "node:child_process";
import { randomBytes } from "node:crypto";
import fs from "node:fs";
import path from "node:path";
import { memberCommands, readMembers, writeMembers } from "./batch";
import { DEFAULT_TIMEOUT_MS, limits, sandboxDir, sandboxSpawn } from "./run-ngspice";

/**
 * Members one session runs before a fresh process replaces it: ngspice keeps a little of every circuit it has seen,
 * and prlimit's CPU cap counts the whole life of the process (so it is this many single runs' caps).
 */
export const SESSION_MEMBERS = 256;
const SESSION_CPU_SECONDS = SESSION_MEMBERS * (DEFAULT_TIMEOUT_MS / 1000 + 1);
const MAX_OUTPUT = 8 * 1024 * 1024;

/**
 * One ngspice process kept between batches, fed on its standard input (`ngspice -p`). A long-lived executor (a
 * worker's simulation slot) then pays ngspice's start-up, and the fork of its own large process, once instead of
 * once per batch: that was most of a short transient's cost. It runs the same commands as a batch deck's control
 * block, in the same sandbox (private directory, minimal environment, prlimit), and knows a batch is over when
 * ngspice echoes the batch's end marker. After any member without its plot, or a timeout, the process is ended:
 * what it holds is then unknown, and the caller runs those members alone, as after a batch.
 */
export class NgspiceSession {
  private readonly dir = sandboxDir();
  private readonly child: ChildProcess;
  private output = "";
  private onOutput: (() => void) | null = null;
  private members = 0;
  private batches = 0;
  private ended = false;

  constructor() {
    // stderr joins stdout in order, so an abort message is read before the end marker that follows it. When the
    // parent dies without close() (a worker SIGKILLed), ngspice reads the end of its input and quits, and the shell
    // then removes the directory. Its own process group, so close() ends shell and ngspice together.
    this.child = spawn("prlimit", [...limits(SESSION_CPU_SECONDS), "--", "sh", "-c", 'ngspice -p 2>&1; cd / && rm -rf -- "$0"', this.dir], {
      ...sandboxSpawn(this.dir), stdio: ["pipe", "pipe", "ignore"], detached: true,
    });
    this.child.stdout!.setEncoding("latin1").on("data", (d: string) => {
      this.output += d;
      this.onOutput?.();
    });
    this.child.stdin!.on("error", () => undefined); // EPIPE once ngspice has gone: the exit below says so
    this.child.on("exit", () => {
      this.ended = true;
      this.onOutput?.();
    });
    this.child.on("error", () => {
      this.ended = true;
      this.onOutput?.();
    });
    this.child.stdin!.write("set filetype=binary\n");
    // A kept process never holds its parent open: while a batch runs, the batch's timer does; when the parent
    // exits, ngspice reads the end of its input and quits.
    this.child.unref();
    for (const pipe of [this.child.stdin, this.child.stdout]) (pipe as unknown as { unref?: () => void } | null)?.unref?.();
  }

  /** Still running, and young enough for another batch. */
  get usable(): boolean {
    return !this.ended && this.members < SESSION_MEMBERS;
  }

  /** The decks' raw files, as runBatchAsync gives them: null where a member must run alone. */
  async run(decks: string[], timeoutMs = DEFAULT_TIMEOUT_MS, signal?: AbortSignal): Promise<(Buffer | null)[]> {
    const prefix = `b${this.batches++}-`;
    const end = `assay-end-${randomBytes(8).toString("hex")}`;
    this.members += decks.length;
    this.output = "";
    writeMembers(this.dir, prefix, decks);
    const finished = await new Promise<boolean>((resolve) => {
      const done = (ok: boolean) => {
        clearTimeout(timer);
        signal?.removeEventListener("abort", cancel);
        this.onOutput = null;
        resolve(ok);
      };
      const cancel = () => done(false);
      const timer = setTimeout(cancel, timeoutMs * decks.length);
      signal?.addEventListener("abort", cancel, { once: true });
      let scanned = 0; // where the marker could start in what has come so far (output runs to megabytes)
      this.onOutput = () => {
        if (this.output.includes(end, scanned)) done(true);
        else if (this.ended || this.output.length > MAX_OUTPUT) done(false);
        scanned = Math.max(0, this.output.length - end.length);
      };
      if (this.ended || signal?.aborted) return done(false);
      this.child.stdin!.write([...memberCommands(prefix, decks.length), `echo ${end}`, ""].join("\n"));
    });
    const raws = finished ? readMembers(this.dir, prefix, decks.length, this.output) : decks.map(() => null);
    this.output = "";
    if (raws.some((r) => !r)) this.close();
    else for (const i of decks.keys()) for (const f of [`${prefix}d${i}.cir`, `${prefix}o${i}.raw`]) fs.rmSync(path.join(this.dir, f), { force: true });
    return raws;
  }

  /** Ends the process (now: nothing of it is wanted any more) and removes its directory. */
  close(): void {
    if (!this.ended) try { process.kill(-this.child.pid!, "SIGKILL"); } catch { /* gone already */ }
    this.ended = true;
    fs.rmSync(this.dir, { recursive: true, force: true });
  }
}
