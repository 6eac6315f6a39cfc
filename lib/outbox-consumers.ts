import { getEm } from "@/lib/db/orm";
import { processNotifications } from "@/lib/mail/notify";
import { processIndexBacklog } from "@/lib/search/indexer";

type Consumer = { name: string; pass: () => Promise<number> };

// Each consumer marks its own column on the outbox rows, so one being down never holds up the other.
const consumers: Consumer[] = [
  { name: "search index", pass: async () => processIndexBacklog(await getEm()) },
  { name: "mail", pass: async () => processNotifications(await getEm()) },
];

/**
 * Poll each consumer until stopped. A consumer whose service is down keeps its events pending and is retried
 * with a growing pause, without holding up the others.
 */
export function runConsumers(opts: { intervalMs?: number; log?: (line: string) => void } = {}): () => Promise<void> {
  const interval = opts.intervalMs ?? 500;
  const log = opts.log ?? ((l) => console.log(l));
  let stopped = false;
  const loops = consumers.map(async (c) => {
    let pause = interval;
    let wasDown = false;
    while (!stopped) {
      try {
        const n = await c.pass();
        if (wasDown) log(`[assay] ${c.name}: reachable again`);
        wasDown = false;
        pause = n > 0 ? 0 : interval;
      } catch (err) {
        if (!wasDown) log(`[assay] ${c.name}: ${(err as Error).message}; events kept for later`);
        wasDown = true;
        pause = Math.min(Math.max(pause * 2, interval), 10_000);
      }
      await new Promise((r) => setTimeout(r, pause));
    }
  });
  return async () => {
    stopped = true;
    await Promise.all(loops);
  };
}
