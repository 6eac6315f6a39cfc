import type { EntityManager } from "@mikro-orm/postgresql";
import { parseBlock } from "@/checks";
import type { Block } from "@/entities";
import { badgesFor } from "@/lib/runs/badge";
import { approvedVersionIds } from "@/lib/reviews/approval";
import type { BlockDocument } from "./client";

/**
 * Search documents for block heads, badges and approvals loaded in one query each.
 * Archived blocks and blocks without a head come back in `removals`.
 */
export async function blockDocuments(em: EntityManager, blocks: Block[]): Promise<{ docs: BlockDocument[]; removals: number[] }> {
  const live = blocks.filter((b) => !b.archived && b.head);
  const removals = blocks.filter((b) => !live.includes(b)).map((b) => b.id);
  await em.populate(live, ["head", "team"]);
  const headIds = live.map((b) => b.head!.id);
  const badges = await badgesFor(em, headIds);
  const approved = await approvedVersionIds(em, headIds);
  const docs = live.map((block): BlockDocument => {
    const head = block.head!;
    return {
      id: block.id,
      slug: block.slug,
      title: block.title,
      summary: block.summary,
      tags: block.tags,
      category: block.category,
      badge: badges.get(head.id)?.badge ?? "unchecked",
      approved: approved.has(head.id),
      team: block.team.slug,
      teamId: block.team.id,
      visibility: block.visibility,
      version: head.number,
      params: head.params.map((p) => p.name),
      body: parseBlock(head.text).block?.note ?? "",
      updatedAt: block.updatedAt.getTime(),
    };
  });
  return { docs, removals };
}
