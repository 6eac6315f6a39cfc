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
  const marker = (i: number) => `assay batch member ${i}`;
  const control = ["* assay batch", ".control", "set filetype=binary"];
  decks.forEach((_, i) => control.push(`source d${i}.cir`, "run", `write o${i}.raw`, "remcirc", "destroy all"));
  control.push("quit", ".endc", ".end", "");
  const job = prepareRun(control.join("\n"), { timeoutMs: timeoutMs * decks.length }, false);
  try {
    decks.forEach((deck, i) => fs.writeFileSync(path.join(job.dir, `d${i}.cir`), `${marker(i)}\n${deck.slice(deck.indexOf("\n") + 1)}`));
    const exit = await execute(job, signal);
    // An aborted analysis may still leave a partial plot under its marker: every member then runs alone, where the
    // abort is the error it is in a single run.
    if (ABORTED.test(`${exit.stderr}\n${exit.stdout}`)) return decks.map(() => null);
    return decks.map((_, i) => {
      try {
        const raw = fs.readFileSync(path.join(job.dir, `o${i}.raw`));
        const title = /^Title: (.*)$/m.exec(raw.subarray(0, 200).toString("latin1"))?.[1];
        return title === marker(i) ? raw : null;
      } catch {
        return null;
      }
    });
  } finally {
    await fs.promises.rm(job.dir, { recursive: true, force: true });
  }
}
