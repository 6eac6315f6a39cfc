// "The latest decision on a version", said once: among approvals and change requests, the newest by created_at,
// ties to the highest id. A version is approved when that decision is an approval (lib/reviews/approval.ts);
// the read path's SQL and the services' queries both come from here.

export const DECISIONS_SQL = "('approved', 'changes-requested')";
export const latestDecisionOrder = "created_at desc, id desc";

/** The latest decision of each version in the ? placeholders. */
export const latestDecisionsSql = (versionPlaceholders: string): string =>
  `select distinct on (version_id) version_id, decision from reviews
    where decision in ${DECISIONS_SQL} and version_id in (${versionPlaceholders})
    order by version_id, ${latestDecisionOrder}`;

/** A sub-select of one version's latest decision: `versionIdSql` is a column reference or a ? placeholder. */
export const latestDecisionOfSql = (versionIdSql: string): string =>
  `select decision from reviews where version_id = ${versionIdSql} and decision in ${DECISIONS_SQL}
    order by ${latestDecisionOrder} limit 1`;
