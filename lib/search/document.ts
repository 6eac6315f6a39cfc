import type { EntityManager } from "@mikro-orm/postgresql";
import { parseBlock } from "@/checks";
import type { Block } from "@/entities";
import { badgeOfVersion } from "@/lib/runs/badge";
import { isApproved } from "@/lib/reviews/reviews";
import type { BlockDocument } from "./client";

/** The search document of a block's head, or null when it should not be searchable (archived, no head). */
export async function blockDocument(em: EntityManager, block: Block): Promise<BlockDocument | null> {
  if (block.archived || !block.head) return null;
  await em.populate(block, ["head", "team"]);
  const head = block.head;
  const parsed = parseBlock(head.text).block;
  return {
    id: block.id,
    slug: block.slug,
    title: block.title,
    summary: block.summary,
    tags: block.tags,
    category: block.category,
    badge: await badgeOfVersion(em, head.id),
    approved: await isApproved(em, head.id),
    team: block.team.slug,
    teamId: block.team.id,
    visibility: block.visibility,
    version: head.number,
    params: head.params.map((p) => p.name),
    body: parsed?.note ?? "",
    updatedAt: block.updatedAt.getTime(),
  };
}
