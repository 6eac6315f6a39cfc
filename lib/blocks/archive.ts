import { BlockSchema, type Visibility } from "@/entities";
import type { Caller } from "@/lib/auth/caller";
import { getEm } from "@/lib/db/orm";
import { AppError } from "@/lib/errors";
import { writeEvent } from "@/lib/outbox/outbox";
import { loadBlock } from "./common";
import { blockEventBase } from "./events";

/** Archived blocks stay readable (links keep working) but leave lists and search and take no new versions. */
export async function archiveBlock(caller: Caller, slug: string): Promise<{ slug: string; archived: true }> {
  const em = await getEm();
  const block = await loadBlock(em, caller, slug, "block.archive");
  if (block.archived) return { slug: block.slug, archived: true };
  await em.transactional(async (tx) => {
    const b = await tx.findOneOrFail(BlockSchema, { id: block.id }, { populate: ["team", "head"] });
    b.archived = true;
    writeEvent(tx, "block.archived", { ...(await blockEventBase(tx, b, b.head)), archived: true });
  });
  return { slug: block.slug, archived: true };
}

/** Team-only or readable by anyone; a maintainer's decision, as it publishes the team's work. */
export async function setVisibility(caller: Caller, slug: string, visibility: Visibility): Promise<{ slug: string; visibility: Visibility }> {
  if (visibility !== "team" && visibility !== "public") throw new AppError("validation", "visibility is team or public");
  const em = await getEm();
  const block = await loadBlock(em, caller, slug, "block.publish");
  if (block.visibility === visibility) return { slug: block.slug, visibility };
  await em.transactional(async (tx) => {
    const b = await tx.findOneOrFail(BlockSchema, { id: block.id }, { populate: ["team", "head"] });
    const previous = b.visibility;
    b.visibility = visibility;
    writeEvent(tx, "block.updated", { ...(await blockEventBase(tx, b, b.head)), change: "visibility", previous });
  });
  return { slug: block.slug, visibility };
}
