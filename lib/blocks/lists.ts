import type { EntityManager } from "@mikro-orm/postgresql";
import { BlockSchema, type Block } from "@/entities";
import { readableTeamIds } from "@/lib/auth/permissions";
import type { Ctx } from "@/lib/context";
import { approvedVersionIds } from "@/lib/reviews/approval";
import { badgesFor } from "@/lib/runs/badge";
import { latestRunOfSql } from "@/lib/runs/latest-run";
import type { BlockSummary } from "@/lib/search/types";

export type { BlockSummary };

/** List rows for blocks (team and head loaded), with badges and approval in two queries. */
export async function summarise(em: EntityManager, blocks: Block[]): Promise<BlockSummary[]> {
  const heads = blocks.filter((b) => b.head).map((b) => b.head!.id);
  const badges = await badgesFor(em, heads);
  const approved = await approvedVersionIds(em, heads);
  return blocks.filter((b) => b.head).map((b) => ({
    slug: b.slug, title: b.title, category: b.category, tags: b.tags, team: b.team.slug, version: b.head!.number,
    badge: badges.get(b.head!.id)!.badge, approved: approved.has(b.head!.id), updatedAt: b.updatedAt.toISOString(),
    summary: b.summary, visibility: b.visibility,
  }));
}

const populate = ["team", "head"] as const;

/** Blocks the caller started or added a version to, newest change first. */
export async function myBlocks({ em, caller }: Ctx): Promise<BlockSummary[]> {
  if (!caller.user) return [];
  const teams = readableTeamIds(caller);
  const mine = await em.getConnection().execute<{ block_id: number }[]>(
    `select distinct block_id from block_versions where author_id = ?`, [caller.user.id]);
  const blocks = await em.find(BlockSchema,
    { archived: false, id: { $in: mine.map((r) => r.block_id) }, $or: [{ team: { $in: teams } }, { visibility: "public" }] },
    { populate, orderBy: { updatedAt: "desc" }, limit: 200 });
  return summarise(em, blocks);
}

/** Readable heads whose latest run verified them, most recently verified first. */
export async function recentlyVerified({ em, caller }: Ctx, limit = 10): Promise<BlockSummary[]> {
  const teams = readableTeamIds(caller);
  const rows = await em.getConnection().execute<{ id: number }[]>(
    `select b.id from blocks b join lateral (
        ${latestRunOfSql("status, finished_at", "b.head_id")}) lr on true
      where b.archived = false and lr.status = 'done'
        and (b.visibility = 'public' ${teams.length ? `or b.team_id in (${teams.map(() => "?").join(",")})` : ""})
      order by lr.finished_at desc limit 200`, teams);
  const byId = new Map((await em.find(BlockSchema, { id: { $in: rows.map((r) => r.id) } }, { populate })).map((b) => [b.id, b]));
  const ordered = rows.map((r) => byId.get(r.id)!).filter(Boolean);
  return (await summarise(em, ordered)).filter((s) => s.badge === "verified").slice(0, Math.max(1, limit));
}

/** Heads in the caller's teams that fail or cannot be evaluated: the work list of a maintainer. */
export async function failingInMyTeams({ em, caller }: Ctx): Promise<BlockSummary[]> {
  const teams = readableTeamIds(caller);
  if (teams.length === 0) return [];
  const blocks = await em.find(BlockSchema, { archived: false, team: { $in: teams } }, { populate, orderBy: { updatedAt: "desc" } });
  return (await summarise(em, blocks)).filter((s) => s.badge === "failing" || s.badge === "error");
}
