import type { MigrationObject } from "@mikro-orm/core";
import { Migration20261202013338 } from "./Migration20261202013338";
import { Migration20261202014357 } from "./Migration20261202014357";
import { Migration20261202023951 } from "./Migration20261202023951";
import { Migration20261202090500 } from "./Migration20261202090500";
import { Migration20261202092600 } from "./Migration20261202092600";
import { Migration20261202093000 } from "./Migration20261202093000";
import { Migration20261202093500 } from "./Migration20261202093500";
import { Migration20261202170000 } from "./Migration20261202170000";

// Every migration, in order. Add new ones at the end; never edit a landed one.
export const migrationsList: MigrationObject[] = [
  { name: "Migration20261202013338", class: Migration20261202013338 },
  { name: "Migration20261202014357", class: Migration20261202014357 },
  { name: "Migration20261202023951", class: Migration20261202023951 },
  { name: "Migration20261202090500", class: Migration20261202090500 },
  { name: "Migration20261202092600", class: Migration20261202092600 },
  { name: "Migration20261202093000", class: Migration20261202093000 },
  { name: "Migration20261202093500", class: Migration20261202093500 },
  { name: "Migration20261202170000", class: Migration20261202170000 },
];
