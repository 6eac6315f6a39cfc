import type { EntityManager } from "@mikro-orm/postgresql";
import { latestDecisionsSql } from "./latest-decision";

/**
 * Versions whose latest decision is an approval. Approval belongs to one version, so a new version
 * starts unapproved by construction; a later "changes-requested" on the same version withdraws it.
 */
export async function approvedVersionIds(em: EntityManager, versionIds: number[]): Promise<Set<number>> {
  if (versionIds.length === 0) return new Set();
  const rows = await em.getConnection().execute<{ version_id: number; decision: string }[]>(
    latestDecisionsSql(versionIds.map(() => "?").join(",")),
    versionIds, "all", em.getTransactionContext(),
  );
  return new Set(rows.filter((r) => r.decision === "approved").map((r) => Number(r.version_id)));
}
