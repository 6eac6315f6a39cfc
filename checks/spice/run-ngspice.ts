import { spawnSync } from "node:child_process";
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { SpiceError } from "./types";

export const DEFAULT_TIMEOUT_MS = 20_000;
export const MAX_RAW_BYTES = 256 * 1024 * 1024;
const MAX_MEMORY_BYTES = 1024 * 1024 * 1024;

export type NgspiceRun = { raw: Buffer; log: string; ms: number };

/**
 * One `ngspice -b -r out.raw deck.cir` in a private temp dir, under prlimit (it execs ngspice,
 * so still one process): address space, CPU seconds and file size are capped, and the wall
 * clock kills it. An empty spinit keeps XSPICE code models (some read files) unloaded.
 * `spinit` lets the raw-reader test ask ngspice for its ASCII form of the same run.
 */
export function runNgspice(
  deck: string,
  opts: { timeoutMs?: number; spinit?: string; circuitOffset?: number; circuit?: string; maxRawBytes?: number } = {},
): NgspiceRun {
  const timeoutMs = opts.timeoutMs ?? DEFAULT_TIMEOUT_MS;
  const maxRaw = opts.maxRawBytes ?? MAX_RAW_BYTES;
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), "assay-spice-"));
  try {
    fs.mkdirSync(path.join(dir, "scripts"));
    fs.writeFileSync(path.join(dir, "scripts", "spinit"), opts.spinit ?? "");
    fs.writeFileSync(path.join(dir, "deck.cir"), deck);
    const cpu = Math.ceil(timeoutMs / 1000) + 1;
    const t0 = performance.now();
    const r = spawnSync(
      "prlimit",
      [`--as=${MAX_MEMORY_BYTES}`, `--cpu=${cpu}`, `--fsize=${maxRaw}`, "--", "ngspice", "-b", "-r", "out.raw", "deck.cir"],
      {
        cwd: dir, encoding: "utf8", timeout: timeoutMs, killSignal: "SIGKILL", maxBuffer: 8 * 1024 * 1024,
        // A minimal environment: nothing of the app (secrets, URLs) reaches the simulator.
        env: { PATH: process.env.PATH ?? "/usr/bin:/bin", HOME: dir, TMPDIR: dir, LANG: "C", SPICE_SCRIPTS: path.join(dir, "scripts"), NODE_ENV: process.env.NODE_ENV },
      },
    );
    const ms = performance.now() - t0;
    const log = `${r.stderr ?? ""}\n${r.stdout ?? ""}`;
    if (r.error && (r.error as NodeJS.ErrnoException).code === "ETIMEDOUT")
      throw new SpiceError(`ngspice did not finish within ${timeoutMs / 1000} s`);
    if (r.error && (r.error as NodeJS.ErrnoException).code === "ENOBUFS") throw new SpiceError("ngspice printed more than 8 MB of messages");
    if (r.error) throw new SpiceError(`cannot run ngspice: ${r.error.message}`);
    if (r.signal === "SIGXCPU") throw new SpiceError(`ngspice used more than ${cpu} s of CPU`);
    if (r.signal === "SIGXFSZ") throw new SpiceError(`simulation output exceeds ${+(maxRaw / 2 ** 20).toFixed(2)} MB`);
    if (r.signal) throw new SpiceError(`ngspice was stopped by ${r.signal} (CPU limit ${cpu} s, memory limit ${MAX_MEMORY_BYTES / 2 ** 20} MB)`);
    const rawPath = path.join(dir, "out.raw");
    // ngspice warns on stderr and carries on; only a bad exit, no raw file or an aborted analysis fails.
    if (r.status !== 0 || !fs.existsSync(rawPath) || ABORTED.test(log))
      throw ngspiceFailure(r.stderr ?? "", opts.circuitOffset ?? 0, opts.circuit ?? "") ?? new SpiceError(`ngspice failed (exit ${r.status ?? r.signal}): ${lastLines(log)}`);
    return { raw: fs.readFileSync(rawPath), log, ms };
  } finally {
    fs.rmSync(dir, { recursive: true, force: true });
  }
}

// ngspice reports netlist trouble on stderr, naming the deck line as "Netlist line no. N".
const NOISE = [/^Note: No compatibility mode/i, /^binary raw file/i, /^ascii raw file/i, /^Using SPARSE/i];
const ABORTED = /simulation\(s\) aborted|timestep too small|analysis aborted/i;
const FATAL = /error|cannot|can't find|undefined|unknown|too small|singular|aborted|not found|failed/i;

function ngspiceFailure(stderr: string, offset: number, circuit: string): SpiceError | null {
  const lines = [...new Set(stderr.split("\n").map((l) => l.trim()).filter((l) => l && !NOISE.some((n) => n.test(l))))];
  if (!lines.some((l) => FATAL.test(l))) return null;
  const at = lines.map((l) => /^(?:Netlist line no\.|Error on line)\s*(\d+)/i.exec(l)).find(Boolean);
  const deckLine = at ? Number(at[1]) : undefined;
  const line = deckLine !== undefined && deckLine > offset ? deckLine - offset : quotedLine(lines.join(" "), circuit);
  const message = lines.filter((l) => !/^(Netlist line no\.|Error on line)/i.test(l) && !/fatal error in ngspice/i.test(l)).slice(0, 4).join("; ");
  return new SpiceError(`ngspice: ${message || lines.join("; ")}`, line);
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
