import type { Role } from "@/entities";
import { ROLES, leastRoleFor, type Action } from "@/lib/auth/permissions";

// Who may make and revoke API tokens, in the words the API reference and the settings page print. Built from the
// permission table the token services check, so the pages cannot promise more or less than the server does.

/** The roles that may take an action in their team, lowest first. */
export function rolesThatMay(action: Action): Role[] {
  return ROLES.slice(ROLES.indexOf(leastRoleFor(action)));
}

/** The subject of a rule with its verb agreeing: "Every member of a team … makes", "A team's admins … make". */
function whoDoes(action: Action, verb: { one: string; many: string }): string {
  const roles = rolesThatMay(action);
  if (roles.length === ROLES.length) return `Every member of a team, whatever their role, ${verb.one}`;
  const names = roles.map((r) => `${r}s`);
  return `A team's ${names.length > 1 ? `${names.slice(0, -1).join(", ")} and ${names.at(-1)}` : names[0]} ${verb.many}`;
}

export interface TokenRules {
  /** Who makes tokens (in Settings → API tokens). */
  create: string;
  /** What a token may do. */
  reach: string;
  /** Who sees and revokes every token of a team. */
  manage: string;
}

export function tokenRules(): TokenRules {
  return {
    create: `${whoDoes("token.create", { one: "makes", many: "make" })} API tokens of their own for that team.`,
    reach: "A token acts as its owner in that one team and never does more than the owner's role there; a read token cannot write, and a token cannot make tokens.",
    manage: `${whoDoes("token.manage", { one: "also sees and revokes", many: "also see and revoke" })} every token of their team.`,
  };
}
