import type { MigrationObject } from "@mikro-orm/core";
import { Migration20261202013338 } from "./Migration20261202013338";

// Every migration, in order. Add new ones at the end; never edit a landed one.
export const migrationsList: MigrationObject[] = [
  { name: "Migration20261202013338", class: Migration20261202013338 },
];
