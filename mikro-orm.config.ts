import { defineConfig } from "@mikro-orm/postgresql";
import { Migrator } from "@mikro-orm/migrations";
import { allEntities } from "./entities";
import { databaseUrl } from "./lib/db/database-url";
import { migrationsList } from "./migrations";

export default defineConfig({
  clientUrl: databaseUrl(),
  entities: allEntities,
  discovery: { disableDynamicFileAccess: true },
  extensions: [Migrator],
  migrations: {
    path: "./migrations",
    pathTs: "./migrations",
    tableName: "mikro_orm_migrations",
    transactional: true,
    snapshot: true,
    snapshotName: ".snapshot-assay",
    // Listed by name so the Next bundle and tsx both find them.
    migrationsList,
  },
  pool: { min: 0, max: 10 },
  debug: false,
});
