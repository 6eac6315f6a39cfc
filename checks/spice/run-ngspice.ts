import { spawn, spawnSync } from "node:child_process";
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { engineSpinit } from "./spinit";
import { SpiceError } from "./types";

export const DEFAULT_TIMEOUT_MS = 20_000;
export const MAX_RAW_BYTES = 256 * 1024 * 1024;
const MAX_MEMORY_BYTES = 1024 * 1024 * 1024;

export type NgspiceRun = { raw: Buffer; log: string; ms: number };

/**
 * One `ngspice -b -r out.raw deck.cir` in a private temp dir, under prlimit (it execs ngspice,
 * so still one process): address space, CPU seconds and file size are capped, and the wall
 * clock kills it. The engine's spinit loads only spice2poly (POLY sources); other XSPICE code
 * models (some read files) stay unloaded.
 * `spinit` lets the raw-reader test ask ngspice for its ASCII form of the same run.
 */
export function runNgspice(
  deck: string,
  opts: RunOptions = {},
): NgspiceRun {
  const job = prepareRun(deck, opts);
  try {
    const t0 = performance.now();
    const r = spawnSync(job.command, job.args, { ...job.spawn, encoding: "utf8", timeout: job.timeoutMs, killSignal: "SIGKILL", maxBuffer: 8 * 1024 * 1024 });
    const code = (r.error as NodeJS.ErrnoException | undefined)?.code;
    return finishRun(job, { status: r.status, signal: r.signal, stdout: r.stdout ?? "", stderr: r.stderr ?? "", error: r.error, timedOut: code === "ETIMEDOUT", overflow: code === "ENOBUFS" }, performance.now() - t0, opts);
  } finally {
    fs.rmSync(job.dir, { recursive: true, force: true });
  }
}

/** The same run without blocking the event loop, so an executor can keep several ngspice processes busy. */
export async function runNgspiceAsync(deck: string, opts: RunOptions = {}): Promise<NgspiceRun> {
  const job = prepareRun(deck, opts);
  try {
    const t0 = performance.now();
    const r = await execute(job, opts.signal);
    return finishRun(job, r, performance.now() - t0, opts);
  } finally {
    await fs.promises.rm(job.dir, { recursive: true, force: true });
  }
}

/**
 * Spawn a prepared job and collect its exit, output and whether it overran. An aborted `signal` kills the
 * process (prlimit execs ngspice, so that is ngspice itself) and the exit says so; already aborted, nothing starts.
 */
export function execute(job: Job, signal?: AbortSignal): Promise<Exit> {
  return new Promise<Exit>((resolve) => {
    if (signal?.aborted) return resolve({ status: null, signal: null, stdout: "", stderr: "", timedOut: false, overflow: false, aborted: true });
    const child = spawn(job.command, job.args, { ...job.spawn, stdio: ["ignore", "pipe", "pipe"] });
    let stdout = "";
    let stderr = "";
    let overflow = false;
    let timedOut = false;
    let aborted = false;
    const onAbort = () => {
      aborted = true;
      child.kill("SIGKILL");
    };
    signal?.addEventListener("abort", onAbort, { once: true });
    const take = (add: string, to: "out" | "err") => {
      if (stdout.length + stderr.length + add.length > 8 * 1024 * 1024) {
        overflow = true;
        child.kill("SIGKILL");
        return;
      }
      if (to === "out") stdout += add;
      else stderr += add;
    };
    child.stdout!.setEncoding("utf8").on("data", (d: string) => take(d, "out"));
    child.stderr!.setEncoding("utf8").on("data", (d: string) => take(d, "err"));
    const timer = setTimeout(() => {
      timedOut = true;
      child.kill("SIGKILL");
    }, job.timeoutMs);
    child.on("error", (error) => {
      clearTimeout(timer);
      signal?.removeEventListener("abort", onAbort);
      resolve({ status: null, signal: null, stdout, stderr, error, timedOut, overflow, aborted });
    });
    child.on("close", (status, sig) => {
      clearTimeout(timer);
      signal?.removeEventListener("abort", onAbort);
      resolve({ status, signal: sig, stdout, stderr, timedOut, overflow, aborted });
    });
  });
}

export type RunOptions = { timeoutMs?: number; spinit?: string; circuitOffset?: number; circuit?: string; maxRawBytes?: number; signal?: AbortSignal };
export type Job = { dir: string; command: string; args: string[]; spawn: { cwd: string; env: NodeJS.ProcessEnv }; timeoutMs: number; cpu: number; maxRaw: number };
export type Exit = { status: number | null; signal: NodeJS.Signals | null; stdout: string; stderr: string; error?: Error; timedOut: boolean; overflow: boolean; aborted?: boolean };

export function prepareRun(deck: string, opts: RunOptions, rawFile = true): Job {
  const timeoutMs = opts.timeoutMs ?? DEFAULT_TIMEOUT_MS;
  const maxRaw = opts.maxRawBytes ?? MAX_RAW_BYTES;
  const dir = sandboxDir(opts.spinit);
  fs.writeFileSync(path.join(dir, "deck.cir"), deck);
  const cpu = Math.ceil(timeoutMs / 1000) + 1;
  return {
    dir, timeoutMs, cpu, maxRaw,
    command: "prlimit",
    args: [...limits(cpu, maxRaw), "--", "ngspice", "-b", ...(rawFile ? ["-r", "out.raw"] : []), "deck.cir"],
    spawn: sandboxSpawn(dir),
  };
}

/** A private temp dir holding the engine's spinit: ngspice's working directory, HOME and TMPDIR. */
export function sandboxDir(spinit = engineSpinit()): string {
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), "assay-spice-"));
  fs.mkdirSync(path.join(dir, "scripts"));
  fs.writeFileSync(path.join(dir, "scripts", "spinit"), spinit);
  return dir;
}

/** prlimit's caps: address space, CPU seconds, and the size of any file ngspice writes. */
export const limits = (cpuSeconds: number, maxRawBytes = MAX_RAW_BYTES) => [`--as=${MAX_MEMORY_BYTES}`, `--cpu=${cpuSeconds}`, `--fsize=${maxRawBytes}`];

// A minimal environment: nothing of the app (secrets, URLs) reaches the simulator.
export const sandboxSpawn = (dir: string) => ({
  cwd: dir,
  env: { PATH: process.env.PATH ?? "/usr/bin:/bin", HOME: dir, TMPDIR: dir, LANG: "C", SPICE_SCRIPTS: path.join(dir, "scripts"), NODE_ENV: process.env.NODE_ENV },
});

function finishRun(job: Job, r: Exit, ms: number, opts: RunOptions): NgspiceRun {
  const { cpu, maxRaw, timeoutMs } = job;
  const log = `${r.stderr}\n${r.stdout}`;
  if (r.aborted) throw new SpiceError("the simulation was cancelled");
  if (r.timedOut) throw new SpiceError(`ngspice did not finish within ${timeoutMs / 1000} s`);
  if (r.overflow) throw new SpiceError("ngspice printed more than 8 MB of messages");
  if (r.error) throw new SpiceError(`cannot run ngspice: ${r.error.message}`);
  if (r.signal === "SIGXCPU") throw new SpiceError(`ngspice used more than ${cpu} s of CPU`);
  if (r.signal === "SIGXFSZ") throw new SpiceError(`simulation output exceeds ${+(maxRaw / 2 ** 20).toFixed(2)} MB`);
  if (r.signal) throw new SpiceError(`ngspice was stopped by ${r.signal} (CPU limit ${cpu} s, memory limit ${MAX_MEMORY_BYTES / 2 ** 20} MB)`);
  const rawPath = path.join(job.dir, "out.raw");
  // ngspice warns on stderr and carries on; only a bad exit, no raw file or an aborted analysis fails.
  if (r.status !== 0 || !fs.existsSync(rawPath) || ABORTED.test(log))
    throw ngspiceFailure(r.stderr, opts.circuitOffset ?? 0, opts.circuit ?? "") ?? new SpiceError(`ngspice failed (exit ${r.status ?? r.signal}): ${lastLines(log)}`);
  return { raw: fs.readFileSync(rawPath), log, ms };
}

// ngspice reports netlist trouble on stderr, naming the deck line as "Netlist line no. N".
const NOISE = [/^Note: No compatibility mode/i, /^binary raw file/i, /^ascii raw file/i, /^Using SPARSE/i];
export const ABORTED = /simulation\(s\) aborted|timestep too small|analysis aborted/i;
const FATAL = /error|cannot|can't find|undefined|unknown|too small|singular|aborted|not found|failed/i;

function ngspiceFailure(stderr: string, offset: number, circuit: string): SpiceError | null {
  const lines = [...new Set(stderr.split("\n").map((l) => l.trim()).filter((l) => l && !NOISE.some((n) => n.test(l))))];
  if (!lines.some((l) => FATAL.test(l))) return null;
  const at = lines.map((l) => /^(?:Netlist line no\.|Error on line)\s*(\d+)/i.exec(l)).find(Boolean);
  const deckLine = at ? Number(at[1]) : undefined;
  const said = lines.join(" ");
  const line = deckLine !== undefined && deckLine > offset ? deckLine - offset : (quotedLine(said, circuit) ?? checkNodeLine(said, circuit));
  const message = lines.filter((l) => !/^(Netlist line no\.|Error on line)/i.test(l) && !/fatal error in ngspice/i.test(l)).slice(0, 4).join("; ");
  return new SpiceError(`ngspice: ${message || lines.join("; ")}`, line);
}

// "singular matrix: check node X" names a node, or a source's branch ("v2#branch"): point at the
// source's line, or at the first element line that connects the node.
function checkNodeLine(text: string, circuit: string): number | undefined {
  const m = /check node\s+(\S+)/i.exec(text);
  if (!m) return undefined;
  const name = m[1].toLowerCase();
  const branch = /^(.*)#branch$/.exec(name);
  const lines = circuit.split("\n").map((l) => l.trim().toLowerCase().split(/\s+/));
  const k = branch
    ? lines.findIndex((t) => t[0] === branch[1])
    : lines.findIndex((t) => /^[a-z]/.test(t[0] ?? "") && !t[0].startsWith(".") && t.slice(1, 5).includes(name));
  return k >= 0 ? k + 1 : undefined;
}

// Some messages quote the offending card instead of numbering it: find it in the circuit.
function quotedLine(text: string, circuit: string): number | undefined {
  const said = text.toLowerCase().replace(/\s+/g, " ");
  let best: { line: number; length: number } | undefined;
  circuit.split("\n").forEach((l, i) => {
    const card = l.trim().toLowerCase().replace(/\s+/g, " ");
    if (card.length >= 4 && !card.startsWith("*") && said.includes(card) && card.length > (best?.length ?? 0))
      best = { line: i + 1, length: card.length };
  });
  return best?.line;
}

const lastLines = (log: string) => log.trim().split("\n").slice(-4).join("; ");
