import type { EntityManager } from "@mikro-orm/postgresql";
import { includedNames, parseBlock } from "@/checks";

export interface DependentHead {
  blockId: number;
  slug: string;
  title: string;
  teamId: number;
  team: string;
  visibility: "team" | "public";
  headId: number;
  version: number;
}

const likeEscape = (s: string) => s.replace(/[\\%_]/g, (c) => `\\${c}`);

/**
 * Heads of unarchived blocks (of `teamIds`, or of every team when null) that use model file `name`: their circuit
 * includes it, or a run of the head simulated with it (an include through another model file).
 */
export async function dependentHeads(em: EntityManager, name: string, teamIds: number[] | null): Promise<DependentHead[]> {
  const teams = teamIds === null ? "" : teamIds.length ? `and b.team_id in (${teamIds.map(() => "?").join(",")})` : "and false";
  const rows = await em.getConnection().execute<Record<string, unknown>[]>(
    `select b.id, b.slug, b.title, b.team_id, t.slug as team_slug, b.visibility, b.head_id, v.number, v.text,
            exists (select 1 from check_runs r where r.version_id = b.head_id and r.models @> ?::jsonb) as by_run
       from blocks b join block_versions v on v.id = b.head_id join teams t on t.id = b.team_id
      where b.archived = false ${teams}
        and (v.text ilike ? or exists (select 1 from check_runs r where r.version_id = b.head_id and r.models @> ?::jsonb))
      order by b.slug`,
    [JSON.stringify([{ name }]), ...(teamIds ?? []), `%${likeEscape(name)}%`, JSON.stringify([{ name }])], "all", em.getTransactionContext());
  return rows
    .filter((r) => r.by_run || includedNames(parseBlock(String(r.text)).block?.netlist ?? "").includes(name))
    .map((r) => ({
      blockId: Number(r.id), slug: String(r.slug), title: String(r.title), teamId: Number(r.team_id), team: String(r.team_slug),
      visibility: r.visibility as "team" | "public", headId: Number(r.head_id), version: Number(r.number),
    }));
}

/** Every run of those heads, and every run of the team that simulated with `name`, now describes an older model. */
export async function markRunsOutdated(em: EntityManager, teamId: number, name: string, headIds: number[]): Promise<void> {
  await em.getConnection().execute(
    `update check_runs set models_outdated = true
      where models_outdated = false
        and (version_id in (select v.id from block_versions v join blocks b on b.id = v.block_id where b.team_id = ?) and models @> ?::jsonb
             ${headIds.length ? `or version_id in (${headIds.map(() => "?").join(",")})` : ""})`,
    [teamId, JSON.stringify([{ name }]), ...headIds], "run", em.getTransactionContext());
}
