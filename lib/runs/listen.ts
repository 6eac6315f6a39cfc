import pg from "pg";
import { databaseUrl } from "@/lib/db/database-url";

/**
 * LISTEN on channels and call `onNotify` for each NOTIFY; when the connection is lost (a database restart, a
 * terminated backend) it connects and listens again with a growing pause, so the caller never falls back to
 * polling for good. `onRestored` runs after each reconnect: anything sent meanwhile was missed.
 */
export function listenFor(opts: {
  channels: string[];
  onNotify: (n: pg.Notification) => void;
  onRestored?: () => void;
  log: (line: string) => void;
}): { stop: () => Promise<void> } {
  const { channels, onNotify, log } = opts;
  const channel = channels.join(", ");
  let stopped = false;
  let client: pg.Client | null = null;
  let pause = 500;
  let timer: NodeJS.Timeout | undefined;

  const connect = async () => {
    if (stopped) return;
    const c = new pg.Client({ connectionString: databaseUrl(), application_name: `assay-listen-${channels[0]}`.slice(0, 63) });
    c.on("notification", (n) => onNotify(n));
    c.on("error", (err) => lost(c, err.message));
    c.on("end", () => lost(c, "connection ended"));
    try {
      await c.connect();
      await c.query(channels.map((ch) => `LISTEN ${ch}`).join("; "));
      client = c;
      if (pause > 500) {
        log(`LISTEN ${channel} restored`);
        opts.onRestored?.();
      }
      pause = 500;
    } catch (err) {
      lost(c, (err as Error).message);
    }
  };

  const lost = (c: pg.Client, why: string) => {
    if (stopped || (client !== null && client !== c)) return;
    client = null;
    c.removeAllListeners("end");
    c.end().catch(() => undefined);
    clearTimeout(timer);
    log(`LISTEN ${channel} lost (${why}); trying again in ${pause / 1000} s`);
    timer = setTimeout(() => void connect(), pause);
    pause = Math.min(pause * 2, 10_000);
  };

  void connect();
  return {
    stop: async () => {
      stopped = true;
      clearTimeout(timer);
      await client?.end().catch(() => undefined);
    },
  };
}
