import type { EntityManager } from "@mikro-orm/postgresql";
import { CheckRunSchema, type CheckRun, type RunModel } from "@/entities";
import { assertCan } from "@/lib/auth/permissions";
import { loadBlock, resourceOf } from "@/lib/blocks/common";
import type { Ctx } from "@/lib/context";
import { AppError } from "@/lib/errors";
import type { RunInput, RunListInput } from "@/lib/validation/runs";
import { badgeOfRun, currentStamp, type Badge } from "./badge";

export interface RunView {
  id: string; slug: string; version: number; status: CheckRun["status"]; badge: Badge; trigger: string;
  report: Record<string, unknown> | null; error: string | null; attempts: number; durationMs: number | null;
  progress: { done: number; total: number };
  engineVersion: string | null; ngspiceVersion: string | null; modelLibraryHash: string | null;
  /** The model files this run simulated with: name, sha256, team or shared, team version. */
  models: RunModel[] | null;
  createdAt: string; startedAt: string | null; finishedAt: string | null;
}

// The id is a UUID (runInputSchema): anything else never reaches the database.
async function loadRun({ em, caller }: Ctx, { id }: RunInput, populate: ("waveforms")[] = []): Promise<CheckRun> {
  const run = await em.findOne(CheckRunSchema, { id }, { populate: ["version", "version.block", "version.block.team", ...populate] });
  if (!run) throw new AppError("not_found", "no such run");
  assertCan(caller, "block.read", resourceOf(run.version.block));
  return run;
}

const view = (run: CheckRun, stamp = currentStamp()): RunView => ({
  id: run.id, slug: run.version.block.slug, version: run.version.number, status: run.status,
  badge: badgeOfRun(run, stamp), trigger: run.trigger, report: run.report, error: run.error, attempts: run.attempts,
  progress: { done: run.progressDone ?? 0, total: run.progressTotal ?? 0 },
  durationMs: run.durationMs, engineVersion: run.engineVersion, ngspiceVersion: run.ngspiceVersion,
  modelLibraryHash: run.modelLibraryHash, models: run.models ?? null, createdAt: run.createdAt.toISOString(),
  startedAt: run.startedAt?.toISOString() ?? null, finishedAt: run.finishedAt?.toISOString() ?? null,
});

export async function getRun(ctx: Ctx, input: RunInput): Promise<RunView> {
  return view(await loadRun(ctx, input));
}

/** Every run of every version of the block, newest first. */
export async function listRuns({ em, caller }: Ctx, { slug, limit }: RunListInput): Promise<RunView[]> {
  const block = await loadBlock(em, caller, slug);
  return runsOfBlock(em, block.id, limit);
}

/** The runs of a block the caller was already allowed to read, newest first. */
export async function runsOfBlock(em: EntityManager, blockId: number, limit = 100): Promise<RunView[]> {
  const runs = await em.find(CheckRunSchema, { version: { block: { id: blockId } } },
    { populate: ["version", "version.block"], orderBy: { createdAt: "desc" }, limit: Math.min(Math.max(1, limit), 500) });
  const stamp = currentStamp();
  return runs.map((r) => view(r, stamp));
}

/** A run's stored series, for a page that has already read its block. */
export async function waveformsOfRun(em: EntityManager, runId: string): Promise<unknown[]> {
  const run = await em.findOne(CheckRunSchema, { id: runId }, { populate: ["waveforms"] });
  return run?.waveforms ?? [];
}

/** The downsampled series the engine returned with the report (empty until the run is done). */
export async function getWaveforms(ctx: Ctx, input: RunInput): Promise<unknown[]> {
  const run = await loadRun(ctx, input, ["waveforms"]);
  return run.waveforms ?? [];
}

