import type { Role, TokenScope } from "@/entities";

export interface CallerMembership {
  teamId: number;
  teamSlug: string;
  role: Role;
}

/**
 * Who is asking. A signed-out visitor has user = null and no memberships.
 * A token caller is bound to one team: memberships holds only that team, and `token.scope` caps the role.
 */
export interface Caller {
  user: { id: number; email: string; name: string } | null;
  memberships: CallerMembership[];
  token: { id: number; teamId: number; scope: TokenScope } | null;
}

export const anonymous: Caller = { user: null, memberships: [], token: null };
