import { closeOrm, getEm } from "../lib/db/orm";
import { seedPeople } from "../lib/seed/seed-people";
import { seedLibrary } from "../lib/seed/seed-library";

// Idempotent: a second run creates nothing.
async function main() {
  const people = await seedPeople(await getEm());
  const library = await seedLibrary(await getEm());
  console.log(`[assay] demo data: ${people.created} people/teams/memberships and ${library.created} blocks created`);
}

main()
  .catch((err: Error) => {
    console.error(`[assay] seeding failed: ${err.message}`);
    process.exitCode = 1;
  })
  .finally(closeOrm);
