import { getEm } from "@/lib/db/orm";
import { supervisedParts } from "./parts";

export type PartHealth = "ok" | string;
export interface Health {
  db: PartHealth;
  search: PartHealth;
  worker: PartHealth;
  indexBacklog: number;
  /** Under npm start: every part it runs (web, worker, search, mail, consumers), "ok" or why it is down. */
  parts?: Record<string, string>;
}

type Probe = () => Promise<PartHealth>;
type BacklogProbe = () => Promise<number>;

// Parts register their own probes (search, worker) so this module needs no knowledge of them.
const probes: { search?: Probe; worker?: Probe; backlog?: BacklogProbe } = {};
export function registerHealthProbe(part: "search" | "worker", probe: Probe): void {
  probes[part] = probe;
}
export function registerBacklogProbe(probe: BacklogProbe): void {
  probes.backlog = probe;
}

async function safely<T>(fn: (() => Promise<T>) | undefined, fallback: T): Promise<T | string> {
  if (!fn) return fallback;
  try {
    return await fn();
  } catch (err) {
    return (err as Error).message || "unreachable";
  }
}

export async function checkHealth(): Promise<Health> {
  const db = await safely(async () => {
    const em = await getEm();
    await em.getConnection().execute("select 1");
    return "ok";
  }, "ok");
  const search = await safely(probes.search, "not configured");
  const worker = await safely(probes.worker, "not configured");
  const backlog = await safely(probes.backlog, 0);
  const parts = supervisedParts();
  const health: Health = { db, search, worker, indexBacklog: typeof backlog === "number" ? backlog : -1 };
  if (Object.keys(parts).length === 0) return health;
  // A part the supervisor is restarting is down whatever its last heartbeat says.
  if (parts.worker && parts.worker !== "ok") health.worker = parts.worker;
  if (parts.search && parts.search !== "ok") health.search = parts.search;
  return { ...health, parts };
}
