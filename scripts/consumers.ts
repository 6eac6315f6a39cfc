import { closeOrm } from "../lib/db/orm";
import { runConsumers } from "../lib/outbox-consumers";

// Keeps the search index and the mail notifications in step with the outbox.
const stop = runConsumers();
console.log("[assay] outbox consumers running");
for (const sig of ["SIGINT", "SIGTERM"] as const) {
  process.on(sig, () => {
    void stop().then(closeOrm).then(() => process.exit(0));
  });
}
