import type { EntityManager } from "@mikro-orm/postgresql";
import { UserSchema, WatchSchema, type Block, type BlockVersion } from "@/entities";

/**
 * The common part of every block event's payload, so consumers need no query of their own:
 * the mailer reads watcher and author addresses, the indexer reads slug and team.
 */
export async function blockEventBase(em: EntityManager, block: Block, version: BlockVersion | null): Promise<Record<string, unknown>> {
  const author = version ? await em.findOne(UserSchema, { id: version.author.id }) : null;
  const watches = await em.find(WatchSchema, { block: block.id }, { populate: ["user"] });
  return {
    slug: block.slug,
    title: block.title,
    team: block.team.slug,
    visibility: block.visibility,
    archived: block.archived,
    version: version?.number ?? null,
    authorEmail: author?.email ?? null,
    authorName: author?.name ?? null,
    watchers: watches.map((w) => w.user.email),
  };
}
