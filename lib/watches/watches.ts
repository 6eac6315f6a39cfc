import type { EntityManager } from "@mikro-orm/postgresql";
import { WatchSchema } from "@/entities";
import type { Ctx } from "@/lib/context";
import { loadBlock, requireUser } from "@/lib/blocks/common";
import type { BlockInput } from "@/lib/validation/blocks";

/** Watchers are named in every block event's payload (`watchers`), which the mailer turns into mail. */
export async function watch({ em, caller }: Ctx, input: BlockInput): Promise<{ watching: true }> {
  const user = requireUser(caller);
  const block = await loadBlock(em, caller, input.slug);
  await em.getConnection().execute(
    `insert into watches (user_id, block_id, created_at) values (?, ?, now()) on conflict (user_id, block_id) do nothing`,
    [user.id, block.id]);
  return { watching: true };
}

export async function unwatch({ em, caller }: Ctx, input: BlockInput): Promise<{ watching: false }> {
  const user = requireUser(caller);
  const block = await loadBlock(em, caller, input.slug);
  await em.nativeDelete(WatchSchema, { user: user.id, block: block.id });
  return { watching: false };
}

export async function isWatching({ em, caller }: Ctx, input: BlockInput): Promise<boolean> {
  if (!caller.user) return false;
  const block = await loadBlock(em, caller, input.slug);
  return (await em.count(WatchSchema, { user: caller.user.id, block: block.id })) > 0;
}

/** Whether this person watches a block the page has already read. */
export async function watchesBlock(em: EntityManager, userId: number, blockId: number): Promise<boolean> {
  return (await em.count(WatchSchema, { user: userId, block: blockId })) > 0;
}
