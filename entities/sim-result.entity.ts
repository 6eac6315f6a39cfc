import { EntitySchema, type Opt } from "@mikro-orm/core";
import type { CheckRun } from "./check-run.entity";

/**
 * The outcome of one simulation of a run, written by whichever worker ran its `simulate` job and read by the
 * worker coordinating the run. Keyed by the request's content hash; the raw file ngspice wrote, or why there is none.
 * A worker that sees the coordinator's simulation cache leaves the raw file there instead (`rawInCache`).
 */
export interface SimResult {
  run: CheckRun;
  key: string;
  ok: boolean;
  raw: Buffer | null;
  rawInCache: Opt<boolean>;
  error: string | null;
  line: number | null;
  ms: number;
  cached: boolean;
  workerId: string;
  createdAt: Opt<Date>;
}

export const SimResultSchema = new EntitySchema<SimResult>({
  name: "SimResult",
  tableName: "sim_results",
  properties: {
    run: { kind: "m:1", entity: "CheckRun", primary: true, deleteRule: "cascade" },
    key: { type: "string", length: 64, primary: true },
    ok: { type: "boolean" },
    raw: { type: "blob", nullable: true, lazy: true },
    rawInCache: { type: "boolean", default: false },
    error: { type: "text", nullable: true },
    line: { type: "integer", nullable: true },
    ms: { type: "double" },
    cached: { type: "boolean" },
    workerId: { type: "string", length: 64 },
    createdAt: { type: "Date", onCreate: () => new Date(), index: true },
  },
});
