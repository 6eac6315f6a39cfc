import { readFileSync } from "node:fs";

// What the supervisor (scripts/supervise.ts) writes about each part npm start runs, and how health reads it.
export type PartState =
  | { status: "starting"; restarts: number }
  | { status: "up"; pid?: number; restarts: number; since: string }
  | { status: "down"; exit: string; restarts: number; since: string; retryAt: string };

/** 1 s, 2 s, 4 s … up to 30 s between restarts of a part that keeps exiting. */
export function backoffMs(restarts: number): number {
  return Math.min(1000 * 2 ** restarts, 30_000);
}

/** Each supervised part as "ok" or why it is down; empty when nothing supervises this process. */
export function supervisedParts(file = process.env.ASSAY_PARTS_FILE): Record<string, string> {
  if (!file) return {};
  let states: Record<string, PartState>;
  try {
    states = JSON.parse(readFileSync(file, "utf8")) as Record<string, PartState>;
  } catch {
    return {};
  }
  return Object.fromEntries(Object.entries(states).map(([name, s]) => [name, s.status === "down"
    ? `down since ${s.since} (exited with ${s.exit}); restart ${s.restarts} at ${s.retryAt}`
    : "ok"]));
}
