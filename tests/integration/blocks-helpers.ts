// Shared by the blocks-, runs- and reviews- integration tests: a team of our own per test file, callers from
// the database, block files, and an in-process worker that drains the file's own database (test files run in parallel).
import { readFileSync } from "node:fs";
import path from "node:path";
import { randomUUID } from "node:crypto";
import { withParams } from "@/checks";
import { MembershipSchema, TeamSchema, UserSchema, type Role } from "@/entities";
import type { Caller } from "@/lib/auth/caller";
import { loadCaller } from "@/lib/auth/load-caller";
import { getEm } from "@/lib/db/orm";
import { processNext } from "@/lib/runs/execute";

export interface TestTeam {
  slug: string;
  id: number;
  tag: string;
  author: Caller;
  author2: Caller;
  maintainer: Caller;
  viewer: Caller;
  outsider: Caller;
}

export async function makeTeam(): Promise<TestTeam> {
  const tag = randomUUID().slice(0, 8);
  const em = await getEm();
  const team = em.create(TeamSchema, { slug: `t-${tag}`, name: `Test bench ${tag}`, createdAt: new Date() });
  const other = em.create(TeamSchema, { slug: `o-${tag}`, name: `Other ${tag}`, createdAt: new Date() });
  const people: Record<string, { role: Role; team: typeof team }> = {
    author: { role: "author", team }, author2: { role: "author", team }, maintainer: { role: "maintainer", team },
    viewer: { role: "viewer", team }, outsider: { role: "admin", team: other },
  };
  const ids: Record<string, number> = {};
  for (const [who, p] of Object.entries(people)) {
    const user = em.create(UserSchema, { email: `${who}-${tag}@bench.test`, name: `${who} ${tag}`, passwordHash: null, createdAt: new Date() });
    em.create(MembershipSchema, { user, team: p.team, role: p.role, createdAt: new Date() });
    await em.flush();
    ids[who] = user.id;
  }
  const c = async (who: string) => loadCaller(await getEm(), ids[who]);
  return {
    slug: team.slug, id: team.id, tag, author: await c("author"), author2: await c("author2"),
    maintainer: await c("maintainer"), viewer: await c("viewer"), outsider: await c("outsider"),
  };
}

export const contentBlock = (file: string, slug: string, params: Record<string, string> = {}): string =>
  withParams(readFileSync(path.resolve("content/blocks", file), "utf8"), params, { slug });

/** Runs the queued check runs of this file's database in this process, through the worker's own code path, until none is left. */
export async function drain(team: TestTeam, workerId = `test-${team.tag}`): Promise<number> {
  let n = 0;
  for (;;) {
    const r = await processNext(workerId);
    if (r.outcome === "idle") return n;
    n++;
  }
}

/**
 * Our own Wien-bridge fixture without amplitude control: gain A = 1 + Rf/Rg around the equal-arm network whose
 * feedback fraction at f0 = 1/(2 pi R C) is 1/3, so the loop gain is A/3 (Sedra & Smith, Microelectronic Circuits,
 * 7th ed., Wien-bridge oscillator, from memory). Above one the kick grows until the op-amp clips; below it dies.
 */
export const wienFixture = (slug: string): string => `---
slug: ${slug}
title: Wien-bridge fixture without amplitude control
category: oscillator
tags: [test]
summary: A kick grows when the loop gain exceeds one and dies when it does not.
params:
  - { name: R, value: 10 kohm, tol: 1% }
  - { name: C, value: 10 nF, tol: 5% }
  - { name: Rg, value: 10 kohm, tol: 1% }
  - { name: Rf, value: 22 kohm, tol: 1% }
  - { name: Vkick, value: 0.5 V }
---
Fixture for the run queue tests.

\`\`\`spice
* Wien bridge around a non-inverting amplifier, no amplitude control
.include opamp-1pole.lib
X1 p n out OA1P
Rs out a {R}
Cs a p {C}
Rp p 0 {R}
Cp p 0 {C}
Rg n 0 {Rg}
Rf n out {Rf}
.ic v(p)={Vkick}
\`\`\`

\`\`\`check
f0 = 1 / (2 pi R C) to Hz
loop_gain = (1 + Rf / Rg) / 3
check("loop gain above one at every corner", loop_gain > 1.02)
res = tran(20 ms, 10 us)
check("the oscillation builds up to ten times the kick", pp(res, "out", 15 ms, 20 ms) > 10 Vkick)
\`\`\`
`;

/** A block with design equations only: no simulation, so its run measures the queue and the sandbox. */
export const dividerBlock = (slug: string, r2 = "10 kohm"): string => `---
slug: ${slug}
title: Resistive divider, expression checks only
category: reference
tags: [test]
summary: Divider ratio from the two resistors.
params:
  - { name: R1, value: 10 kohm, tol: 1% }
  - { name: R2, value: ${r2}, tol: 1% }
  - { name: Vin, value: 5 V, tol: 2% }
---
Vout = Vin R2 / (R1 + R2), the voltage divider (common practice).

\`\`\`spice
V1 in 0 {Vin}
R1 in out {R1}
R2 out 0 {R2}
\`\`\`

\`\`\`check
Vout = Vin R2 / (R1 + R2)
check("output within 2.3 V to 2.7 V at every corner", Vout > 2.3 V and Vout < 2.7 V)
\`\`\`
`;
