import { randomUUID } from "node:crypto";
import { MembershipSchema, TeamSchema, UserSchema, type Role } from "@/entities";
import type { Caller } from "@/lib/auth/caller";
import { getEm } from "@/lib/db/orm";

/** A team of its own for one test, with one member per requested role; returns their callers. */
export async function makeTeam(roles: Role[] = ["viewer", "author", "maintainer", "admin"]) {
  const em = await getEm();
  const tag = randomUUID().slice(0, 8);
  const team = em.create(TeamSchema, { slug: `t-${tag}`, name: `Team ${tag}` });
  const callers = {} as Record<Role, Caller>;
  for (const role of roles) {
    const user = em.create(UserSchema, { email: `${role}-${tag}@people.test`, name: `${role} ${tag}`, passwordHash: null });
    em.create(MembershipSchema, { user, team, role });
    await em.flush();
    callers[role] = { user: { id: user.id, email: user.email, name: user.name }, memberships: [{ teamId: team.id, teamSlug: team.slug, role }], token: null };
  }
  return { team: { id: team.id, slug: team.slug }, tag, callers };
}

/** A small expression-only block file with a unique slug. */
export function rcBlock(slug: string, title = "RC low-pass for search tests", summary = "One-pole passive filter") {
  return `---
slug: ${slug}
title: ${title}
category: filter
tags: [passive, anti-alias]
summary: ${summary}
params:
  - { name: R, value: 3.3 kohm, tol: 1% }
  - { name: C, value: 22 nF, tol: 5% }
---
A one-pole low-pass. $f_c = 1/(2\\pi R C)$.

\`\`\`spice
V1 in 0 AC 1
R1 in out {R}
C1 out 0 {C}
\`\`\`

\`\`\`check
fc = 1 / (2 pi R C)
check("corner frequency in band", fc > 1.5 kHz and fc < 3 kHz)
\`\`\`
`;
}
