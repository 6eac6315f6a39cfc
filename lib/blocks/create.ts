import { UniqueConstraintViolationException } from "@mikro-orm/core";
import { BlockSchema, TeamSchema } from "@/entities";
import { assertCan } from "@/lib/auth/permissions";
import type { Ctx } from "@/lib/context";
import { AppError } from "@/lib/errors";
import type { NewBlockInput } from "@/lib/validation/blocks";
import { parseOrThrow, requireUser } from "./common";
import { defaultTeam } from "./team-default";
import { storeVersion, type StoredResult } from "./store";

export type { NewBlockInput };

/** A new block from a block file: version 1, its run queued in the same transaction. */
export async function createBlock({ em, caller }: Ctx, input: NewBlockInput): Promise<StoredResult> {
  const user = requireUser(caller);
  const teamSlug = input.team ?? defaultTeam(caller);
  const team = await em.findOne(TeamSchema, { slug: teamSlug });
  if (!team) throw new AppError("not_found", `no team "${teamSlug}"`);
  assertCan(caller, "block.create", { kind: "team", teamId: team.id });
  const visibility = input.visibility ?? "team";
  if (visibility === "public") assertCan(caller, "block.publish", { kind: "team", teamId: team.id });
  const parsed = parseOrThrow(input.text);
  try {
    return await em.transactional(async (tx) => {
      if (await tx.count(BlockSchema, { slug: parsed.slug })) throw taken(parsed.slug);
      const block = tx.create(BlockSchema, {
        slug: parsed.slug, team, title: parsed.title, summary: parsed.summary, category: parsed.category as never,
        tags: parsed.tags, hazard: parsed.hazard, visibility, head: null, forkedFrom: null, archived: false, createdAt: new Date(), updatedAt: new Date(),
      });
      await tx.flush();
      const { result } = await storeVersion(tx, {
        block, number: 1, text: input.text, parsed, authorId: user.id, message: input.message ?? "created",
      });
      return result;
    });
  } catch (err) {
    if (err instanceof UniqueConstraintViolationException) throw taken(parsed.slug);
    throw err;
  }
}

const taken = (slug: string) => new AppError("conflict", `the slug "${slug}" is taken`, { slug });
