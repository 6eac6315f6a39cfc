// The sandboxed entry points. Kept apart from index.ts so a caller that only verifies (the CLI)
// does not load mathjs in its own process: the child does all evaluation.
import type { RunProgress, SimExecutor } from "../engine/executor";
import { runCapFromEnv, type RunCap } from "../engine/plan";
import type { Report, Waveform } from "../engine/types";
import { reportStatus } from "../engine/status";
import { previewLane, verifyLane, type SandboxLane } from "./client";
import type { ModelTexts } from "../spice/sanitize";

const PREVIEW_TIMEOUT_MS = 3_000;
const VERIFY_TIMEOUT_MS = 120_000;

function slugOf(text: string): string {
  return /^slug:\s*["']?([a-z0-9-]+)/m.exec(String(text ?? ""))?.[1] ?? "";
}

function errorReport(text: string, message: string): Report {
  const report: Report = { slug: slugOf(text), status: "error", quantities: {}, checks: [], simulations: [], errors: [{ message }] };
  report.status = reportStatus(report);
  return report;
}

/** Optional: start the sandbox children now so the first preview does not wait for them to load. */
export function warmEngine(): void {
  previewLane.warm();
  verifyLane.warm();
}

export type VerifyOptions = {
  simulate?: boolean;
  params?: Record<string, string>;
  timeoutMs?: number;
  /** Simulation cache folder of the default (local) executor. */
  cacheDir?: string;
  /** Runs the simulations instead of ngspice processes in the sandbox child (e.g. a queue over workers). */
  executor?: SimExecutor;
  /** Simulations finished of those the run needs, as they finish. */
  onProgress?: RunProgress;
  /** Default: ASSAY_RUN_MAX_SIMULATIONS / ASSAY_RUN_MAX_SIM_SECONDS of this process. */
  cap?: RunCap;
  /** Model files `.include` names, resolved by the caller for the block's team (team first, then shared). */
  models?: ModelTexts;
  /** The sandbox child to run in (the CLI runs one per core); the shared verify lane by default. */
  lane?: SandboxLane;
};

/** Full verification in the sandbox child. Never throws for bad input: errors go in the report. */
export async function verifyBlock(text: string, opts: VerifyOptions = {}): Promise<{ report: Report; waveforms: Waveform[] }> {
  const { timeoutMs = VERIFY_TIMEOUT_MS, executor, onProgress, cap = runCapFromEnv(), lane = verifyLane, ...rest } = opts;
  const reply = await lane.request("verify", String(text ?? ""), { ...rest, cap, remote: Boolean(executor) }, timeoutMs, { executor, progress: onProgress });
  if (!reply.ok) return { report: errorReport(text, reply.error ?? "the check run failed"), waveforms: [] };
  return reply.value as { report: Report; waveforms: Waveform[] };
}

/** Live preview: quantities and every non-simulated check with its tolerance corners; no simulation. */
export async function previewBlock(text: string, params?: Record<string, string>, models?: ModelTexts): Promise<Report> {
  const reply = await previewLane.request("preview", String(text ?? ""), { params, models }, PREVIEW_TIMEOUT_MS);
  if (!reply.ok) return errorReport(text, reply.error ?? "the preview failed");
  return reply.value as Report;
}

/** Retune assistant: solve for `param` so that `target.quantity` reaches `target.value`, then snap to `series`. */
export async function retune(
  text: string,
  req: { param: string; target: { quantity: string; value: string }; series: string; models?: ModelTexts },
): Promise<{ value: string; snapped: string; report: Report }> {
  const reply = await previewLane.request("retune", String(text ?? ""), req, PREVIEW_TIMEOUT_MS * 3);
  if (!reply.ok) throw new Error(reply.error ?? "the retune failed");
  return reply.value as { value: string; snapped: string; report: Report };
}
