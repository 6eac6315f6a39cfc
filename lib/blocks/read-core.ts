import { createHash } from "node:crypto";
import type { EntityManager } from "@mikro-orm/postgresql";
import { parseBlock } from "@/checks";
import type { RunModel, StoredParam } from "@/entities";
import type { Caller } from "@/lib/auth/caller";
import { assertCan, can } from "@/lib/auth/permissions";
import { AppError } from "@/lib/errors";
import { latestDecisionOfSql } from "@/lib/reviews/latest-decision";
import { badgeOfRun, currentStamp, type Badge } from "@/lib/runs/badge";
import { latestRunOfSql } from "@/lib/runs/latest-run";

// The read path of one block version in two round trips of plain SQL: the block with the asked version, its
// author and its parent (one query, so the permission check comes before anything else is looked at), then the
// version's latest run, its latest review decision and the block's forks (one query of sub-selects).
// No entity hydration: these reads are the API's hottest path and ORM loading was most of their cost.

type Row = Record<string, unknown>;

export interface ReadCore {
  block: { id: number; slug: string; title: string; summary: string; category: string; tags: string[]; hazard: string[];
    visibility: "team" | "public"; archived: boolean; teamId: number; teamSlug: string; headNumber: number | null;
    /** Author of version 1: "own block" for the author role. */
    creatorId: number | null };
  version: { id: number; number: number; params: StoredParam[]; contentHash: string; message: string; createdAt: Date; author: string };
  parent: { slug: string; version: number; title: string; headNumber: number | null } | null;
  badge: Badge;
  approved: boolean;
  run: { id: string; status: string; report: Record<string, unknown> | null; reportDigest: string | null; models: RunModel[] | null } | null;
  forks: { slug: string; title: string; fromVersion: number }[] | null;
}

const exec = (em: EntityManager, sql: string, params: unknown[]) =>
  em.getConnection().execute<Row[]>(sql, params, "all", em.getTransactionContext()) as Promise<Row[]>;

const BLOCK_SQL = `
select b.id, b.slug, b.title, b.summary, b.category, b.tags, b.hazard, b.visibility, b.archived, b.team_id,
       t.slug as team_slug, h.number as head_number,
       (select x.author_id from block_versions x where x.block_id = b.id and x.number = 1) as creator_id,
       v.id as v_id, v.number as v_number, v.params as v_params, v.content_hash as v_hash, v.message as v_message,
       v.created_at as v_created_at, u.name as v_author,
       pv.number as p_number, pb.slug as p_slug, pb.title as p_title, pb.team_id as p_team_id,
       pb.visibility as p_visibility, ph.number as p_head_number
  from blocks b
  join teams t on t.id = b.team_id
  left join block_versions h on h.id = b.head_id
  left join block_versions v on v.id = coalesce((select x.id from block_versions x where x.block_id = b.id and x.number = ?), case when ?::int is null then b.head_id end)
  left join users u on u.id = v.author_id
  left join block_versions pv on pv.id = b.forked_from_id
  left join blocks pb on pb.id = pv.block_id
  left join block_versions ph on ph.id = pb.head_id
 where b.slug = ?`;

// Latest run and latest decision by the one rule each (lib/runs/latest-run.ts, lib/reviews/latest-decision.ts).
// Forks: unarchived children, oldest first.
const detailSql = (withForks: boolean) => `
select (select row_to_json(lr) from (${latestRunOfSql("id, status, report, engine_version, model_library_hash, models_outdated, models, md5(report::text) as report_md5", "?")}) lr) as run,
       (${latestDecisionOfSql("?")}) as decision,
       ${withForks ? `(select coalesce(json_agg(json_build_object('slug', c.slug, 'title', c.title, 'fromVersion', fv.number,
                 'teamId', c.team_id, 'visibility', c.visibility) order by c.created_at, c.id), '[]'::json)
          from blocks c join block_versions fv on fv.id = c.forked_from_id
         where fv.block_id = ? and c.archived = false)` : "null"} as forks`;

const readable = (caller: Caller, teamId: number, visibility: string) =>
  can(caller, "block.read", { kind: "block", teamId: Number(teamId), visibility: visibility as "team" | "public", authorId: null });

/** Block, version (the head when `number` is undefined), badge, approval, run and (withForks) the readable forks. */
export interface ReadOptions {
  forks: boolean;
  /** Lineage alone does not need a version: a block without one still answers (badge unchecked, no run). */
  versionOptional?: boolean;
}

export async function readCore(em: EntityManager, caller: Caller, slug: string, number: number | undefined, opts: ReadOptions): Promise<ReadCore> {
  const withForks = opts.forks;
  const n = number ?? null;
  const [b] = await exec(em, BLOCK_SQL, [n, n, slug]);
  if (!b) throw new AppError("not_found", "no such block");
  assertCan(caller, "block.read", { kind: "block", teamId: Number(b.team_id), visibility: b.visibility as "team" | "public", authorId: null });
  if ((b.v_id === null || b.v_id === undefined) && !opts.versionOptional) {
    throw new AppError("not_found", n === null ? "the block has no version" : `no version ${n} of ${b.slug}`);
  }
  const [d] = await exec(em, detailSql(withForks), withForks ? [b.v_id, b.v_id, b.id] : [b.v_id, b.v_id]);
  const r = d.run as Row | null;
  const run = r ? { id: String(r.id), status: String(r.status), report: (r.report ?? null) as Record<string, unknown> | null, reportDigest: (r.report_md5 ?? null) as string | null, models: (r.models ?? null) as RunModel[] | null } : null;
  // The parent of a public fork may be a team block: name it only to those who may read it.
  const parent = b.p_slug && readable(caller, b.p_team_id as number, b.p_visibility as string)
    ? { slug: String(b.p_slug), version: Number(b.p_number), title: String(b.p_title), headNumber: b.p_head_number === null ? null : Number(b.p_head_number) }
    : null;
  const forks = withForks
    ? (d.forks as Row[]).filter((c) => readable(caller, c.teamId as number, c.visibility as string))
        .map((c) => ({ slug: String(c.slug), title: String(c.title), fromVersion: Number(c.fromVersion) }))
    : null;
  return {
    block: {
      id: Number(b.id), slug: String(b.slug), title: String(b.title), summary: String(b.summary), category: String(b.category),
      tags: b.tags as string[], hazard: b.hazard as string[], visibility: b.visibility as "team" | "public", archived: Boolean(b.archived),
      teamId: Number(b.team_id), teamSlug: String(b.team_slug), headNumber: b.head_number === null ? null : Number(b.head_number),
      creatorId: b.creator_id === null || b.creator_id === undefined ? null : Number(b.creator_id),
    },
    version: {
      id: Number(b.v_id), number: Number(b.v_number), params: b.v_params as StoredParam[], contentHash: String(b.v_hash),
      message: String(b.v_message), createdAt: new Date(b.v_created_at as Date), author: String(b.v_author),
    },
    parent,
    badge: badgeOfRun(r ? { status: r.status, report: r.report, engineVersion: r.engine_version, modelLibraryHash: r.model_library_hash, modelsOutdated: r.models_outdated } as never : null, currentStamp()),
    approved: d.decision === "approved",
    run,
    forks,
  };
}

// A version's text never changes and its content hash is the sha256 of that text: keep text and parse per
// process keyed by the hash, so a read fetches the text column only the first time.
type Parsed = ReturnType<typeof parseBlock>["block"];
const fileCache = new Map<string, { text: string; parsed: Parsed }>();

export async function versionFile(em: EntityManager, versionId: number, contentHash: string): Promise<{ text: string; parsed: Parsed }> {
  let hit = fileCache.get(contentHash);
  if (!hit) {
    const [row] = await exec(em, "select text from block_versions where id = ?", [versionId]);
    const text = String(row.text);
    hit = { text, parsed: parseBlock(text).block };
    if (fileCache.size >= 500) fileCache.delete(fileCache.keys().next().value!);
    fileCache.set(contentHash, hit);
  }
  return hit;
}

// Bump when the Block JSON's shape or its derivation changes, so validators issued by older code stop matching.
const REPRESENTATION = "block-json/2";

/**
 * A strong validator computed from everything the Block JSON is a function of — block row, version row, author
 * name, badge, approval, run (id, status, report digest) and lineage as this caller sees it — so a 304 needs no body.
 */
export function blockValidator(c: ReadCore, parentNewerVersions: number): string {
  const basis = JSON.stringify([REPRESENTATION, c.block, c.version, c.badge, c.approved,
    c.run ? [c.run.id, c.run.status, c.run.reportDigest] : null, c.parent, parentNewerVersions, c.forks]);
  return `"b.${createHash("sha256").update(basis).digest("base64url").slice(0, 32)}"`;
}
