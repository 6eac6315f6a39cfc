import { getOrm } from "./orm";

/** Apply every pending migration; returns the names applied. */
export async function migrateUp(): Promise<string[]> {
  const orm = await getOrm();
  const done = await orm.getMigrator().up();
  return done.map((m) => m.name);
}
