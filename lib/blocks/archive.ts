import { BlockSchema, type Visibility } from "@/entities";
import type { Ctx } from "@/lib/context";
import { writeEvent } from "@/lib/outbox/outbox";
import type { BlockInput, VisibilityInput } from "@/lib/validation/blocks";
import { loadBlock } from "./common";
import { blockEventBase } from "./events";

/** Archived blocks stay readable (links keep working) but leave lists and search and take no new versions. */
export async function archiveBlock({ em, caller }: Ctx, input: BlockInput): Promise<{ slug: string; archived: true }> {
  const block = await loadBlock(em, caller, input.slug, "block.archive");
  if (block.archived) return { slug: block.slug, archived: true };
  await em.transactional(async (tx) => {
    const b = await tx.findOneOrFail(BlockSchema, { id: block.id }, { populate: ["team", "head"] });
    b.archived = true;
    writeEvent(tx, "block.archived", { ...(await blockEventBase(tx, b, b.head)), archived: true });
  });
  return { slug: block.slug, archived: true };
}

/** Team-only or readable by anyone; a maintainer's decision, as it publishes the team's work. */
export async function setVisibility({ em, caller }: Ctx, input: VisibilityInput): Promise<{ slug: string; visibility: Visibility }> {
  const { visibility } = input;
  const block = await loadBlock(em, caller, input.slug, "block.publish");
  if (block.visibility === visibility) return { slug: block.slug, visibility };
  await em.transactional(async (tx) => {
    const b = await tx.findOneOrFail(BlockSchema, { id: block.id }, { populate: ["team", "head"] });
    const previous = b.visibility;
    b.visibility = visibility;
    writeEvent(tx, "block.updated", { ...(await blockEventBase(tx, b, b.head)), change: "visibility", previous });
  });
  return { slug: block.slug, visibility };
}
