// npm run reverify: queue a run for every head made stale by a new engine or model library (and every head never run).
import { closeOrm, getEm } from "../lib/db/orm";
import { enqueueStaleHeads } from "../lib/runs/reverify";

async function main() {
  const { queued, slugs } = await enqueueStaleHeads(await getEm());
  console.log(`[assay] queued ${queued} head version(s) for verification${slugs.length ? ": " + slugs.join(", ") : ""}`);
}

main()
  .catch((err: Error) => {
    console.error(`[assay] reverify failed: ${err.message}`);
    process.exitCode = 1;
  })
  .finally(closeOrm);
