import type { Caller } from "@/lib/auth/caller";
import { roleIn } from "@/lib/auth/permissions";
import { AppError } from "@/lib/errors";

/** DESIGN.md: where a route takes `team`, a token's own team is the default; a person in one team needs to name none. */
export function defaultTeam(caller: Caller): string {
  const own = caller.token ? caller.memberships.find((m) => m.teamId === caller.token!.teamId) : undefined;
  if (own) return own.teamSlug;
  if (caller.memberships.length === 1) return caller.memberships[0].teamSlug;
  throw new AppError("validation", "team: name the team (?team=SLUG); you are in several", { errors: [{ path: "team", message: "required: you are in several teams" }] });
}

/** The team a new file is evaluated for: named or the default, and one the caller belongs to (any role). */
export function teamForEvaluation(caller: Caller, named?: string): { slug: string; id: number } {
  if (!caller.user) throw new AppError("unauthenticated", "sign in or send an API token to evaluate a file");
  const slug = named ?? defaultTeam(caller);
  const m = caller.memberships.find((x) => x.teamSlug === slug);
  if (!m || roleIn(caller, m.teamId) === null) throw new AppError("not_found", `no team "${slug}"`);
  return { slug, id: m.teamId };
}
