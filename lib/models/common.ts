import { TeamSchema, type Team } from "@/entities";
import { assertCan, can, type Action } from "@/lib/auth/permissions";
import { AppError } from "@/lib/errors";

import type { Ctx } from "@/lib/context";

/** The team name under which the shared model library (content/models) appears in routes and pages. */
export const SHARED = "shared";

export const MAX_MODEL_FILE_BYTES = 512 * 1024;

/**
 * The team by slug after checking `action`. A team the caller cannot read answers 404, so its existence and its
 * models do not leak (DESIGN.md: other teams see nothing of a team's models).
 */
export async function loadTeam(ctx: Ctx, slug: string, action: Action): Promise<Team> {
  const team = await ctx.em.findOne(TeamSchema, { slug });
  const resource = { kind: "team" as const, teamId: team?.id ?? -1 };
  if (!team || !can(ctx.caller, "model.read", resource)) throw new AppError("not_found", `no model library "${slug}"`);
  assertCan(ctx.caller, action, resource);
  return team;
}

/** Teams whose models the caller reads: one named team, the token's team, or every team of a signed-in user. */
export async function readableTeams(ctx: Ctx, slug?: string): Promise<Team[]> {
  if (slug) return [await loadTeam(ctx, slug, "model.read")];
  const ids = ctx.caller.memberships.filter((m) => can(ctx.caller, "model.read", { kind: "team", teamId: m.teamId })).map((m) => m.teamId);
  if (ids.length === 0) return [];
  return ctx.em.find(TeamSchema, { id: { $in: ids } }, { orderBy: { slug: "asc" } });
}

/** A signed-out or bad-token caller learns nothing about what would validate (DESIGN.md "REST API v1"): 401. */
export function parseFor<T>(ctx: Ctx, parse: () => T): T {
  try {
    return parse();
  } catch (err) {
    if (!ctx.caller.user) throw new AppError("unauthenticated", "sign in first");
    throw err;
  }
}
