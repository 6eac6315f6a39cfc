import type { EntityManager } from "@mikro-orm/postgresql";
import { MembershipSchema, TeamSchema, UserSchema } from "@/entities";
import { hashPassword } from "@/lib/auth/passwords";
import { DEMO_PASSWORD, demoPeople, demoTeams } from "./demo-people";

/** Teams, people and memberships of the demo; creates only what is missing, changes nothing else. */
export async function seedPeople(em: EntityManager): Promise<{ created: number }> {
  let created = 0;
  for (const t of demoTeams) {
    if (!(await em.findOne(TeamSchema, { slug: t.slug }))) {
      em.create(TeamSchema, t);
      created++;
    }
  }
  await em.flush();
  const hash = await hashPassword(DEMO_PASSWORD);
  for (const p of demoPeople) {
    let user = await em.findOne(UserSchema, { email: p.email });
    if (!user) {
      user = em.create(UserSchema, { email: p.email, name: p.name, passwordHash: hash });
      created++;
    }
    for (const m of p.memberships) {
      const team = await em.findOneOrFail(TeamSchema, { slug: m.team });
      if (!(await em.findOne(MembershipSchema, { user, team }))) {
        em.create(MembershipSchema, { user, team, role: m.role });
        created++;
      }
    }
    await em.flush();
  }
  return { created };
}
