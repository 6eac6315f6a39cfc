import { migrateUp } from "../lib/db/migrate";
import { closeOrm } from "../lib/db/orm";

migrateUp()
  .then((names) => console.log(names.length ? `[assay] migrations applied: ${names.join(", ")}` : "[assay] database schema is up to date"))
  .catch((err: Error) => {
    console.error(`[assay] migrations failed: ${err.message}`);
    process.exitCode = 1;
  })
  .finally(closeOrm);
