// npm run reverify: queue a run for every head made stale by a new engine or model library (and every head never run).
// --team SLUG (repeatable) limits it to those teams.
import { TeamSchema } from "../entities";
import { closeOrm, getEm } from "../lib/db/orm";
import { enqueueStaleHeads } from "../lib/runs/reverify";

async function main() {
  const args = process.argv.slice(2);
  const em = await getEm(); // the script's one unit of work
  const teamIds: number[] = [];
  for (const slug of args.flatMap((a, i) => (a === "--team" && args[i + 1] ? [args[i + 1]] : []))) {
    const team = await em.findOne(TeamSchema, { slug });
    if (!team) throw new Error(`no team "${slug}"`);
    teamIds.push(team.id);
  }
  const { queued, slugs } = await enqueueStaleHeads(em, { teamIds });
  console.log(`[assay] queued ${queued} head version(s) for verification${slugs.length ? ": " + slugs.join(", ") : ""}`);
}

main()
  .catch((err: Error) => {
    console.error(`[assay] reverify failed: ${err.message}`);
    process.exitCode = 1;
  })
  .finally(closeOrm);
