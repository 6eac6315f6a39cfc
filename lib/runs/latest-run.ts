// "The latest run of a version", said once: the newest by created_at, ties to the lowest id. Every SQL that needs
// a version's current run (the read path, badges for lists and search, the library's lists) is built from here,
// and lib/runs/badge.ts derives the badge from the run it picks.

/** ORDER BY that puts a version's latest run first (columns of check_runs, optionally qualified). */
export const latestRunOrder = (alias = ""): string => {
  const c = alias ? `${alias}.` : "";
  return `${c}created_at desc, ${c}id`;
};

/** The latest run of each version in `versionIdsSql` (a list of ? placeholders), with the columns asked for. */
export const latestRunsSql = (columns: string, versionPlaceholders: string): string =>
  `select distinct on (version_id) version_id, ${columns} from check_runs
    where version_id in (${versionPlaceholders}) order by version_id, ${latestRunOrder()}`;

/** A sub-select of one version's latest run: `versionIdSql` is a column reference or a ? placeholder. */
export const latestRunOfSql = (columns: string, versionIdSql: string, alias = "r"): string =>
  `select ${columns} from check_runs ${alias} where ${alias}.version_id = ${versionIdSql} order by ${latestRunOrder(alias)} limit 1`;
