import type { Role } from "@/entities";
import { AppError } from "@/lib/errors";
import type { Caller } from "./caller";

export type Action =
  | "block.read"
  | "block.create"
  | "block.publish"
  | "block.fork"
  | "block.edit"
  | "block.archive"
  | "version.approve"
  | "review.request"
  | "team.manage"
  | "token.create"
  | "token.manage"
  | "model.read"
  | "model.upload";

export interface BlockResource {
  kind: "block";
  teamId: number;
  visibility: "team" | "public";
  /** Author of the head version (or of the version acted on): authors may edit their own. */
  authorId?: number | null;
}
export interface TeamResource {
  kind: "team";
  teamId: number;
}
export type Resource = BlockResource | TeamResource;

const rank: Record<Role, number> = { viewer: 0, author: 1, maintainer: 2, admin: 3 };

const needs: Record<Action, Role> = {
  "block.read": "viewer",
  "block.create": "author",
  "block.fork": "author",
  "block.edit": "author",
  "block.archive": "maintainer",
  // Making a block public publishes the team's work: maintainers decide, at creation as later (DESIGN.md, Roles).
  "block.publish": "maintainer",
  "version.approve": "maintainer",
  "review.request": "author",
  "team.manage": "admin",
  // Every member holds tokens of their own for their team: a token never does more than its owner's role there.
  "token.create": "viewer",
  // Admins also see and revoke every token of their team.
  "token.manage": "admin",
  "model.read": "viewer",
  "model.upload": "author",
};

/** The roles, lowest first. */
export const ROLES = (Object.keys(rank) as Role[]).sort((a, b) => rank[a] - rank[b]);

/** The lowest role an action needs in a team; the roles above it may do it too (pages state rules from this). */
export function leastRoleFor(action: Action): Role {
  return needs[action];
}

const readOnly = new Set<Action>(["block.read", "model.read"]);

/** The caller's effective role in a team: membership role, capped to viewer by a read token. */
export function roleIn(caller: Caller, teamId: number): Role | null {
  const m = caller.memberships.find((x) => x.teamId === teamId);
  if (!m) return null;
  if (caller.token && caller.token.teamId !== teamId) return null;
  if (caller.token?.scope === "read") return "viewer";
  return m.role;
}

/** The one answer to "may this caller do this to this resource", asked by every service entry. */
export function can(caller: Caller, action: Action, resource: Resource): boolean {
  if (action === "block.read" && resource.kind === "block" && resource.visibility === "public") return true;
  const role = roleIn(caller, resource.teamId);
  if (!role) return false;
  if (caller.token?.scope === "read" && !readOnly.has(action)) return false;
  if (rank[role] < rank[needs[action]]) return false;
  // Authors edit their own blocks; maintainers and admins edit any block of the team.
  if (action === "block.edit" && role === "author" && resource.kind === "block") {
    return resource.authorId != null && resource.authorId === caller.user?.id;
  }
  return true;
}

/** Team ids whose team-visible blocks the caller may read (search filters use this). */
export function readableTeamIds(caller: Caller): number[] {
  return caller.memberships.filter((m) => roleIn(caller, m.teamId) !== null).map((m) => m.teamId);
}


/**
 * Throws for a refused action. A team block the caller cannot read answers 404, not 403,
 * so its existence does not leak (DESIGN.md: team blocks answer 404 outside the team).
 */
export function assertCan(caller: Caller, action: Action, resource: Resource): void {
  if (can(caller, action, resource)) return;
  if (resource.kind === "block" && !can(caller, "block.read", resource)) throw new AppError("not_found", "no such block");
  throw new AppError(caller.user ? "forbidden" : "unauthenticated", `not allowed: ${action}`);
}
