import fs from "node:fs";
import path from "node:path";
import { ABORTED, DEFAULT_TIMEOUT_MS, execute, prepareRun } from "./run-ngspice";

/** Short analyses share one ngspice process this many at a time (process start-up is much of their cost). */
export const BATCH_SIZE = 16;

/**
 * Several complete decks in one ngspice process: an engine-written control block sources each
 * deck, runs it, writes its raw file and removes the circuit and its plots. Each deck's title is
 * replaced by a marker that its raw file must carry, so a deck that failed can never be answered
 * with another's plot. Returns one raw file per deck, or null where the deck must run alone
 * (which also gives its error message exactly as a single run would).
 */
export async function runBatchAsync(decks: string[], timeoutMs = DEFAULT_TIMEOUT_MS, signal?: AbortSignal): Promise<(Buffer | null)[]> {
  const control = ["* assay batch", ".control", "set filetype=binary", ...memberCommands("", decks.length), "quit", ".endc", ".end", ""];
  const job = prepareRun(control.join("\n"), { timeoutMs: timeoutMs * decks.length }, false);
  try {
    writeMembers(job.dir, "", decks);
    const exit = await execute(job, signal);
    return readMembers(job.dir, "", decks.length, `${exit.stderr}\n${exit.stdout}`);
  } finally {
    await fs.promises.rm(job.dir, { recursive: true, force: true });
  }
}

const marker = (prefix: string, i: number) => `assay batch member ${prefix}${i}`;

/** The commands that run member i: its deck is `<prefix>d<i>.cir` in the working directory, its raw file `<prefix>o<i>.raw`. */
export function memberCommands(prefix: string, count: number): string[] {
  return Array.from({ length: count }, (_, i) => [`source ${prefix}d${i}.cir`, "run", `write ${prefix}o${i}.raw`, "remcirc", "destroy all"]).flat();
}

/** Each deck into `dir`, its title line replaced by the member's marker. */
export function writeMembers(dir: string, prefix: string, decks: string[]): void {
  decks.forEach((deck, i) => fs.writeFileSync(path.join(dir, `${prefix}d${i}.cir`), `${marker(prefix, i)}\n${deck.slice(deck.indexOf("\n") + 1)}`));
}

/**
 * The members' raw files, each only if it carries its own marker. An aborted analysis may still leave a partial plot
 * under its marker: every member then runs alone, where the abort is the error it is in a single run.
 */
export function readMembers(dir: string, prefix: string, count: number, log: string): (Buffer | null)[] {
  if (ABORTED.test(log)) return Array.from({ length: count }, () => null);
  return Array.from({ length: count }, (_, i) => {
    try {
      const raw = fs.readFileSync(path.join(dir, `${prefix}o${i}.raw`));
      const title = /^Title: (.*)$/m.exec(raw.subarray(0, 200).toString("latin1"))?.[1];
      return title === marker(prefix, i) ? raw : null;
    } catch {
      return null;
    }
  });
}
