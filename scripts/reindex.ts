import { closeOrm, getEm } from "../lib/db/orm";
import { reindexAll } from "../lib/search/indexer";

async function main() {
  const n = await reindexAll(await getEm());
  console.log(`[assay] search index rebuilt: ${n} blocks`);
}

main()
  .catch((err: Error) => {
    console.error(`[assay] reindex failed: ${err.message}`);
    process.exitCode = 1;
  })
  .finally(closeOrm);
