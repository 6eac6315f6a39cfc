import { installQueues } from "@/lib/queue/boss";
import { getOrm } from "./orm";

/** Apply every pending migration, then pg-boss's own schema and our queues; returns the migration names applied. */
export async function migrateUp(): Promise<string[]> {
  const orm = await getOrm();
  const done = await orm.getMigrator().up();
  await installQueues();
  return done.map((m) => m.name);
}
