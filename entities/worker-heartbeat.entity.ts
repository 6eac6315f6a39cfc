import { EntitySchema } from "@mikro-orm/core";

// One row per check-run worker process; the health probe reads the newest `seenAt`.
export interface WorkerHeartbeat {
  id: string;
  host: string;
  pid: number;
  runId: string | null;
  startedAt: Date;
  seenAt: Date;
}

export const WorkerHeartbeatSchema = new EntitySchema<WorkerHeartbeat>({
  name: "WorkerHeartbeat",
  tableName: "worker_heartbeats",
  properties: {
    id: { type: "string", length: 64, primary: true },
    host: { type: "string", length: 200 },
    pid: { type: "integer" },
    runId: { type: "uuid", nullable: true },
    startedAt: { type: "Date" },
    seenAt: { type: "Date", index: true },
  },
});
