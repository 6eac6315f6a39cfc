import { MembershipSchema } from "../entities";
import { closeOrm, getEm } from "../lib/db/orm";

// One JSON object a line: { email, team, role } per membership.
async function main() {
  const em = await getEm();
  const rows = await em.find(MembershipSchema, {}, { populate: ["user", "team"], orderBy: { user: { email: "asc" }, team: { slug: "asc" } } });
  for (const m of rows) console.log(JSON.stringify({ email: m.user.email, team: m.team.slug, role: m.role }));
}

main()
  .catch((err: Error) => {
    console.error(`[assay] ${err.message}`);
    process.exitCode = 2;
  })
  .finally(closeOrm);
