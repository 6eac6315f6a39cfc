import { spawnSync } from "node:child_process";

// Bump when the deck text or how ngspice is run changes what a raw file holds.
// 3: a circuit setting .options interp or cshunt no longer shares an ngspice process (both outlive the circuit there),
// so a raw file that a batch neighbour's option changed must not be a cache hit.
export const SPICE_RUNNER_VERSION = "3";

let cached: string | undefined;

/** "ngspice-39" as printed by `ngspice -v`; read once per process. */
export function ngspiceVersion(): string {
  if (cached) return cached;
  const r = spawnSync("ngspice", ["-v"], { encoding: "utf8", timeout: 10_000, env: { PATH: process.env.PATH ?? "/usr/bin:/bin", NODE_ENV: process.env.NODE_ENV } });
  const m = /ngspice-[0-9][\w.+-]*/.exec(`${r.stdout ?? ""}${r.stderr ?? ""}`);
  if (!m) throw new Error(`cannot run ngspice -v: ${r.error?.message ?? (r.stderr || "no version in its output")}`);
  return (cached = m[0]);
}
