import type { EntityManager } from "@mikro-orm/postgresql";
import type { BlockError, CheckReport, Report } from "@/checks";
import { BlockVersionSchema, type CheckRun } from "@/entities";
import type { Ctx } from "@/lib/context";
import { changesBetween, type Changes } from "@/lib/blocks/compare";
import { badgeOfRun, latestRuns } from "@/lib/runs/badge";
import { latestDecisionOfSql } from "./latest-decision";
import { openRequests, queueItem, type QueueItem } from "./reviews";

/** A check as the queue shows it: the report's own fields less the corner table, which only plots need. */
export type QueueCheck = Omit<CheckReport, "corners">;

export interface QueueEntry extends QueueItem {
  /** The author's message for this version. */
  message: string;
  /** The latest run's state, null when the version was never run. */
  run: CheckRun["status"] | null;
  /** Its checks from that run, in the script's order (empty while it runs). */
  checks: QueueCheck[];
  /** What stopped the run from evaluating something, with lines in the block file. */
  errors: BlockError[];
  /** The previous approved version of the same block the changes are read against; null: none yet, all reads as new. */
  against: number | null;
  changes: Changes;
}

/**
 * The review queue with what a reviewer reads before deciding: each waiting version's checks from its latest run and
 * what changed since the block's previous approved version. A fixed number of queries whatever the queue's length.
 */
export async function reviewQueueWithChanges(ctx: Ctx): Promise<QueueEntry[]> {
  const requests = await openRequests(ctx);
  if (requests.length === 0) return [];
  const bases = await previousApproved(ctx.em, requests.map((r) => r.version.id));
  const baseIds = [...new Set(bases.values())];
  const baseVersions = baseIds.length ? await ctx.em.find(BlockVersionSchema, { id: { $in: baseIds } }) : [];
  const byId = new Map(baseVersions.map((v) => [v.id, v]));
  const runs = await latestRuns(ctx.em, [...requests.map((r) => r.version.id), ...baseIds]);

  return requests.map((r) => {
    const v = r.version;
    const run = runs.get(v.id) ?? null;
    const report = run && (run.status === "done" || run.status === "error") ? (run.report as Report | null) : null;
    const base = byId.get(bases.get(v.id) ?? -1) ?? null;
    return {
      ...queueItem(r, badgeOfRun(run)),
      message: v.message,
      run: run?.status ?? null,
      checks: (report?.checks ?? []).map(({ corners: _corners, ...c }) => c),
      errors: report?.errors ?? [],
      against: base?.number ?? null,
      changes: changesBetween(base, v, runs),
    };
  });
}

/** For each version, the id of the newest lower-numbered version of its block whose latest decision is an approval. */
async function previousApproved(em: EntityManager, versionIds: number[]): Promise<Map<number, number>> {
  const rows = await em.getConnection().execute<{ version_id: number; base_id: number | null }[]>(
    `select q.id as version_id,
            (select p.id from block_versions p
              where p.block_id = q.block_id and p.number < q.number and (${latestDecisionOfSql("p.id")}) = 'approved'
              order by p.number desc limit 1) as base_id
       from block_versions q where q.id in (${versionIds.map(() => "?").join(",")})`,
    versionIds, "all", em.getTransactionContext());
  return new Map(rows.filter((r) => r.base_id != null).map((r) => [Number(r.version_id), Number(r.base_id)]));
}
