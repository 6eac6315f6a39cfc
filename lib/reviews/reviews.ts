import type { EntityManager } from "@mikro-orm/postgresql";
import { MembershipSchema, ReviewSchema, UserSchema, type Block, type BlockVersion, type Review, type ReviewDecision } from "@/entities";
import type { Ctx } from "@/lib/context";
import { assertCan, can } from "@/lib/auth/permissions";
import { loadBlock, loadVersion, requireUser, resourceOf } from "@/lib/blocks/common";
import { blockEventBase } from "@/lib/blocks/events";
import { AppError } from "@/lib/errors";
import { writeEvent } from "@/lib/outbox/outbox";
import { badgesFor, type Badge } from "@/lib/runs/badge";
import type { BlockInput } from "@/lib/validation/blocks";
import type { DecisionInput, ReviewTarget } from "@/lib/validation/reviews";

async function target({ em, caller }: Ctx, { slug, version }: ReviewTarget): Promise<{ em: EntityManager; block: Block; v: BlockVersion }> {
  const block = await loadBlock(em, caller, slug);
  const v = await loadVersion(em, block, version);
  await em.populate(v, ["author"]);
  return { em, block, v };
}

/** Maintainers and admins of the team, who may decide; the version's author is left out. */
async function reviewersOf(em: EntityManager, block: Block, authorId: number): Promise<string[]> {
  const rows = await em.find(MembershipSchema, { team: block.team.id, role: { $in: ["maintainer", "admin"] } }, { populate: ["user"] });
  return rows.filter((m) => m.user.id !== authorId).map((m) => m.user.email);
}

/** Asks the team's maintainers to review one version; asking twice for the same version keeps one request. */
export async function requestReview(ctx: Ctx, input: ReviewTarget): Promise<{ id: number; created: boolean }> {
  const { caller } = ctx;
  const user = requireUser(caller);
  const { em, block, v } = await target(ctx, input);
  assertCan(caller, "review.request", resourceOf(block));
  const open = await em.findOne(ReviewSchema, { version: v, decision: "requested" }, { orderBy: { createdAt: "desc" } });
  if (open) {
    const later = await em.count(ReviewSchema, { version: v, decision: { $ne: "requested" }, createdAt: { $gt: open.createdAt } });
    if (later === 0) return { id: open.id, created: false };
  }
  return em.transactional(async (tx) => {
    const r = tx.create(ReviewSchema, { version: v, reviewer: null, requestedBy: tx.getReference(UserSchema, user.id), decision: "requested", comment: "", createdAt: new Date() });
    writeEvent(tx, "review.requested", {
      ...(await blockEventBase(tx, block, v)), requestedBy: user.email, reviewers: await reviewersOf(tx, block, v.author.id),
    });
    await tx.flush();
    return { id: r.id, created: true };
  });
}

/** Approve or ask for changes on one version. Nobody decides on a version they wrote. */
export async function decide(ctx: Ctx, input: DecisionInput): Promise<{ id: number; decision: ReviewDecision }> {
  const { caller } = ctx;
  const { decision, comment } = input;
  const user = requireUser(caller);
  const { em, block, v } = await target(ctx, input);
  assertCan(caller, "version.approve", resourceOf(block));
  if (v.author.id === user.id) throw new AppError("forbidden", "nobody approves their own version: ask another maintainer");
  const text = comment.trim();
  if (decision === "changes-requested" && !text) throw new AppError("validation", "say which changes you ask for");
  return em.transactional(async (tx) => {
    const r = tx.create(ReviewSchema, { version: v, reviewer: tx.getReference(UserSchema, user.id), requestedBy: null, decision, comment: text, createdAt: new Date() });
    const askers = await tx.find(ReviewSchema, { version: v, decision: "requested" }, { populate: ["requestedBy"] });
    writeEvent(tx, "review.decided", {
      ...(await blockEventBase(tx, block, v)), decision, comment: text, reviewer: user.email, reviewerName: user.name,
      requestedBy: [...new Set(askers.map((a) => a.requestedBy?.email).filter(Boolean))],
    });
    await tx.flush();
    return { id: r.id, decision };
  });
}

export interface QueueItem {
  slug: string; title: string; team: string; version: number; badge: Badge; requestedBy: string | null; requestedAt: string;
}

/** The open review requests on head versions of teams where the caller may approve, minus their own versions, oldest first. */
export async function openRequests({ em, caller }: Ctx): Promise<Review[]> {
  if (!caller.user) return [];
  const rows = await em.getConnection().execute<{ review_id: number }[]>(
    `select distinct on (r.version_id) r.id as review_id from reviews r
       join block_versions v on v.id = r.version_id join blocks b on b.head_id = v.id
      where r.decision = 'requested' and b.archived = false and v.author_id <> ?
        and not exists (select 1 from reviews d where d.version_id = r.version_id and d.decision <> 'requested' and d.created_at > r.created_at)
      order by r.version_id, r.created_at`, [caller.user.id]);
  const reviews = await em.find(ReviewSchema, { id: { $in: rows.map((r) => r.review_id) } },
    { populate: ["version", "version.block", "version.block.team", "requestedBy"], orderBy: { createdAt: "asc" } });
  return reviews.filter((r) => can(caller, "version.approve", resourceOf(r.version.block)));
}

/** One open request as the queue lists it, its version's badge from `badges`. */
export const queueItem = (r: Review, badge: Badge): QueueItem => ({
  slug: r.version.block.slug, title: r.version.block.title, team: r.version.block.team.slug, version: r.version.number,
  badge, requestedBy: r.requestedBy?.name ?? null, requestedAt: r.createdAt.toISOString(),
});

/** Open requests on head versions of teams where the caller may approve, minus their own versions. */
export async function reviewQueue(ctx: Ctx): Promise<QueueItem[]> {
  const mine = await openRequests(ctx);
  const badges = await badgesFor(ctx.em, mine.map((r) => r.version.id));
  return mine.map((r) => queueItem(r, badges.get(r.version.id)!.badge));
}

export interface ReviewRow {
  id: number; version: number; decision: ReviewDecision; reviewer: string | null; requestedBy: string | null; comment: string; createdAt: string;
}

/** The review history of a block, newest first. */
export async function reviewsOf({ em, caller }: Ctx, input: BlockInput): Promise<ReviewRow[]> {
  const block = await loadBlock(em, caller, input.slug);
  return reviewRowsOf(em, block.id);
}

/** The review history of a block the caller was already allowed to read, newest first. */
export async function reviewRowsOf(em: EntityManager, blockId: number): Promise<ReviewRow[]> {
  const rows = await em.find(ReviewSchema, { version: { block: { id: blockId } } },
    { populate: ["version", "reviewer", "requestedBy"], orderBy: { createdAt: "desc", id: "desc" } });
  return rows.map((r) => ({
    id: r.id, version: r.version.number, decision: r.decision, reviewer: r.reviewer?.name ?? null,
    requestedBy: r.requestedBy?.name ?? null, comment: r.comment, createdAt: r.createdAt.toISOString(),
  }));
}
