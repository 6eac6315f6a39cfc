import { parseArgs } from "node:util";
import { MembershipSchema, UserSchema } from "../entities";
import { closeOrm, getEm } from "../lib/db/orm";
import { createToken } from "../lib/tokens/tokens";

// npm run -s token -- EMAIL [--team SLUG] [--write] [--name NAME] [--days N]
// Prints a new API token and nothing else on stdout; every problem is one line on stderr and exit 2.
class Usage extends Error {}

async function main(): Promise<void> {
  const { positionals, values } = parseArgs({
    allowPositionals: true,
    options: {
      team: { type: "string" },
      write: { type: "boolean", default: false },
      name: { type: "string", default: "cli" },
      days: { type: "string" },
    },
  });
  if (positionals.length !== 1) throw new Usage("usage: npm run -s token -- EMAIL [--team SLUG] [--write] [--name NAME] [--days N]");
  const email = positionals[0].trim().toLowerCase();
  const em = await getEm();
  const user = await em.findOne(UserSchema, { email });
  if (!user) throw new Usage(`no user with e-mail ${email}`);
  const memberships = await em.find(MembershipSchema, { user }, { populate: ["team"], orderBy: { team: { slug: "asc" } } });
  if (memberships.length === 0) throw new Usage(`${email} is not in any team`);
  let m = memberships[0];
  if (values.team) {
    const found = memberships.find((x) => x.team.slug === values.team);
    if (!found) throw new Usage(`${email} is not in team ${values.team} (teams: ${memberships.map((x) => x.team.slug).join(", ")})`);
    m = found;
  } else if (memberships.length > 1) {
    throw new Usage(`${email} is in several teams (${memberships.map((x) => x.team.slug).join(", ")}): pass --team SLUG`);
  }
  let expiresAt: Date | null = null;
  if (values.days !== undefined) {
    const days = Number(values.days);
    if (!Number.isInteger(days) || days <= 0) throw new Usage("--days must be a whole number of days above 0");
    expiresAt = new Date(Date.now() + days * 86400_000);
  }
  const { token } = await createToken(em, {
    userId: user.id,
    teamId: m.team.id,
    name: values.name!,
    scope: values.write ? "write" : "read",
    expiresAt,
  });
  process.stdout.write(`${token}\n`);
}

main()
  .catch((err: Error) => {
    console.error(`[assay] ${err.message}`);
    process.exitCode = 2;
  })
  .finally(closeOrm);
