// npm run worker [-- --team SLUG ...]: verifies queued check runs and runs simulate jobs of any run until SIGTERM/SIGINT
// (started by npm start). --team limits the start-up sweep of stale heads to those teams; runs come from one queue.
import { TeamSchema } from "../entities";
import { closeOrm, getEm } from "../lib/db/orm";
import { startWorker } from "../lib/runs/worker";

async function main() {
  const args = process.argv.slice(2);
  const teamSlugs = args.flatMap((a, i) => (a === "--team" && args[i + 1] ? [args[i + 1]] : []));
  const teamIds: number[] = [];
  for (const slug of teamSlugs) {
    const team = await (await getEm()).findOne(TeamSchema, { slug });
    if (!team) throw new Error(`no team "${slug}"`);
    teamIds.push(team.id);
  }
  const worker = startWorker({ teamIds, id: process.env.ASSAY_WORKER_ID || undefined });
  let stopping = false;
  const shutdown = async () => {
    if (stopping) return;
    stopping = true;
    await worker.stop();
    await closeOrm();
    process.exit(0);
  };
  process.on("SIGTERM", shutdown);
  process.on("SIGINT", shutdown);
  await worker.done;
}

main().catch(async (err: Error) => {
  console.error(`[worker] stopped: ${err.message}`);
  await closeOrm();
  process.exit(1);
});
