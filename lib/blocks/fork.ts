import { UniqueConstraintViolationException } from "@mikro-orm/core";
import type { EntityManager } from "@mikro-orm/postgresql";
import { withParams } from "@/checks";
import { BlockSchema, TeamSchema, type Team } from "@/entities";
import type { Caller } from "@/lib/auth/caller";
import { assertCan, can } from "@/lib/auth/permissions";
import type { Ctx } from "@/lib/context";
import { AppError } from "@/lib/errors";
import type { ForkInput } from "@/lib/validation/blocks";
import { engineInputError, loadBlock, loadVersion, parseOrThrow, requireUser } from "./common";
import { storeVersion, type StoredResult } from "./store";
import { assertModelsAvailable } from "@/lib/models/resolve";

export type { ForkInput };

/** A new block that starts from one version of another, optionally with new values and title; records forkedFrom. */
export async function forkBlock({ em, caller }: Ctx, input: ForkInput): Promise<StoredResult> {
  const user = requireUser(caller);
  const source = await loadBlock(em, caller, input.source);
  const from = await loadVersion(em, source, input.fromVersion);
  const team = await targetTeam(em, caller, source.team, input.team);
  assertCan(caller, "block.fork", { kind: "team", teamId: team.id });
  // A fork into a team without the source's model files would only fail its run: say which file is missing now.
  if (team.id !== source.team.id) await assertModelsAvailable(em, team.id, team.slug, parseOrThrow(from.text));
  const fileFor = (newSlug: string) => {
    let text: string;
    try {
      text = withParams(from.text, input.params ?? {}, { slug: newSlug, ...(input.title ? { title: input.title } : {}) });
    } catch (err) {
      throw engineInputError(err);
    }
    return { text, parsed: parseOrThrow(text) };
  };
  // A named slug is checked before the transaction, so a bad file is refused without touching the database.
  const named = input.slug ? fileFor(input.slug) : null;
  let parsedSlug = named?.parsed.slug ?? "";
  try {
    return await em.transactional(async (tx) => {
      // A generated slug is picked inside the transaction under a lock on its stem: concurrent bare forks of one
      // block queue here and each sees the slugs the others committed.
      const { text, parsed } = named ?? fileFor(await freeSlug(tx, source.slug));
      parsedSlug = parsed.slug;
      if (await tx.count(BlockSchema, { slug: parsed.slug })) throw taken(parsed.slug);
      const block = tx.create(BlockSchema, {
        slug: parsed.slug, team: tx.getReference(TeamSchema, team.id), title: parsed.title, summary: parsed.summary,
        category: parsed.category as never, tags: parsed.tags, hazard: parsed.hazard, visibility: "team",
        head: null, forkedFrom: from, archived: false, createdAt: new Date(), updatedAt: new Date(),
      });
      await tx.flush();
      await tx.populate(block, ["team"]);
      const { result } = await storeVersion(tx, {
        block, number: 1, text, parsed, authorId: user.id, message: input.message?.trim() || `forked from ${source.slug} v${from.number}`,
        extra: { forkedFrom: { slug: source.slug, version: from.number } },
      });
      return result;
    });
  } catch (err) {
    if (err instanceof UniqueConstraintViolationException) throw taken(parsedSlug);
    throw err;
  }
}

async function targetTeam(em: EntityManager, caller: Caller, sourceTeam: Team, wanted?: string): Promise<Team> {
  if (wanted) {
    const team = await em.findOne(TeamSchema, { slug: wanted });
    if (!team) throw new AppError("not_found", `no team "${wanted}"`);
    return team;
  }
  if (can(caller, "block.fork", { kind: "team", teamId: sourceTeam.id })) return sourceTeam;
  const mine = caller.memberships.find((m) => can(caller, "block.fork", { kind: "team", teamId: m.teamId }));
  if (!mine) throw new AppError(caller.user ? "forbidden" : "unauthenticated", "you may not create blocks in any team");
  return em.findOneOrFail(TeamSchema, { id: mine.teamId });
}

async function freeSlug(em: EntityManager, base: string): Promise<string> {
  const stem = base.slice(0, 90).replace(/-+$/, "");
  await em.getConnection().execute("select pg_advisory_xact_lock(hashtext(?))", [`fork-slug:${stem}`], "all", em.getTransactionContext());
  for (let i = 1; i < 1000; i++) {
    const candidate = i === 1 ? `${stem}-fork` : `${stem}-fork-${i}`;
    if (!(await em.count(BlockSchema, { slug: candidate }))) return candidate;
  }
  throw new AppError("conflict", "no free slug for the fork; name one");
}

const taken = (slug: string) => new AppError("conflict", `the slug "${slug}" is taken`, { slug });
