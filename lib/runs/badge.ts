import type { EntityManager } from "@mikro-orm/postgresql";
import { ENGINE_VERSION, modelLibraryHash } from "@/checks";
import type { CheckRun } from "@/entities";
import type { Badge } from "@/lib/badges/badges";
import { latestRunsSql } from "./latest-run";

export { BADGES, type Badge } from "@/lib/badges/badges";

/** What a run must have been made with to count as current. */
export interface EngineStamp {
  engineVersion: string;
  modelLibraryHash: string;
}
export const currentStamp = (): EngineStamp => ({ engineVersion: ENGINE_VERSION, modelLibraryHash: modelLibraryHash() });

export type RunLike = Pick<CheckRun, "status" | "report" | "engineVersion" | "modelLibraryHash"> & { modelsOutdated?: boolean | null };

/**
 * A version's badge from its latest run. No run, or a script without any check: unchecked.
 * A finished run made with another engine or model library is stale whatever it said.
 */
export function badgeOfRun(run: RunLike | null | undefined, stamp: EngineStamp = currentStamp()): Badge {
  if (!run) return "unchecked";
  if (run.status === "queued" || run.status === "running") return "pending";
  if (run.status === "error") return "error";
  const status = (run.report as { status?: string } | null)?.status;
  if (status === "unchecked") return "unchecked";
  if (run.engineVersion !== stamp.engineVersion || run.modelLibraryHash !== stamp.modelLibraryHash || run.modelsOutdated) return "stale";
  if (status === "verified" || status === "failing" || status === "error") return status;
  return "error";
}

export interface LatestRun {
  id: string;
  versionId: number;
  status: CheckRun["status"];
  report: CheckRun["report"];
  engineVersion: string | null;
  modelLibraryHash: string | null;
  modelsOutdated: boolean;
  finishedAt: Date | null;
  createdAt: Date;
}

/** The newest run of each version, in one query. */
export async function latestRuns(em: EntityManager, versionIds: number[]): Promise<Map<number, LatestRun>> {
  const out = new Map<number, LatestRun>();
  if (versionIds.length === 0) return out;
  const rows = await em.getConnection().execute<Record<string, never>[]>(
    latestRunsSql("id, status, report, engine_version, model_library_hash, models_outdated, finished_at, created_at", versionIds.map(() => "?").join(",")),
    versionIds, "all", em.getTransactionContext(),
  );
  for (const r of rows as Record<string, unknown>[]) {
    out.set(Number(r.version_id), {
      id: String(r.id), versionId: Number(r.version_id), status: r.status as CheckRun["status"],
      report: (r.report ?? null) as CheckRun["report"], engineVersion: (r.engine_version ?? null) as string | null,
      modelLibraryHash: (r.model_library_hash ?? null) as string | null, modelsOutdated: Boolean(r.models_outdated),
      finishedAt: (r.finished_at ?? null) as Date | null, createdAt: r.created_at as Date,
    });
  }
  return out;
}

export interface VersionBadge {
  badge: Badge;
  run: LatestRun | null;
}

export async function badgesFor(em: EntityManager, versionIds: number[], stamp = currentStamp()): Promise<Map<number, VersionBadge>> {
  const runs = await latestRuns(em, versionIds);
  return new Map(versionIds.map((id) => {
    const run = runs.get(id) ?? null;
    return [id, { badge: badgeOfRun(run, stamp), run }];
  }));
}
