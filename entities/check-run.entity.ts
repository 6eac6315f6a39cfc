import { EntitySchema, type Opt } from "@mikro-orm/core";
import type { BlockVersion } from "./block-version.entity";

export type RunStatus = "queued" | "running" | "done" | "error";
export type RunTrigger = "new-version" | "reverify" | "manual";

/** A model file a run simulated with: a team file's version, or a shared file (versioned with the code). */
export interface RunModel {
  name: string;
  sha256: string;
  source: "team" | "shared";
  version: number | null;
}

export interface CheckRun {
  id: string;
  version: BlockVersion;
  status: RunStatus;
  report: Record<string, unknown> | null;
  waveforms: unknown[] | null;
  engineVersion: string | null;
  ngspiceVersion: string | null;
  modelLibraryHash: string | null;
  /** Exactly which model files the run included (null for runs from before team models). */
  models: Opt<RunModel[] | null>;
  /** Set when a team model it used got a newer version: the result no longer describes the block's head. */
  modelsOutdated: Opt<boolean>;
  durationMs: number | null;
  attempts: number;
  trigger: RunTrigger;
  error: string | null;
  /** The worker holding the run and until when; an expired lease means its worker died (lib/runs/lease.ts). */
  leasedBy?: string | null;
  leaseUntil?: Date | null;
  /** The pg-boss job (queue `verify`) that delivers this run to a worker; a retry may replace it. */
  jobId?: string | null;
  /** Simulations finished, of those the run is known to need so far (the total grows as the engine plans more). */
  progressDone?: Opt<number>;
  progressTotal?: Opt<number>;
  createdAt: Opt<Date>;
  startedAt: Date | null;
  finishedAt: Date | null;
}

export const CheckRunSchema = new EntitySchema<CheckRun>({
  name: "CheckRun",
  tableName: "check_runs",
  indexes: [{ properties: ["version", "createdAt"] }, { properties: ["status"] }],
  properties: {
    id: { type: "uuid", primary: true, onCreate: () => crypto.randomUUID() },
    version: { kind: "m:1", entity: "BlockVersion", deleteRule: "cascade" },
    status: { type: "string", length: 16, default: "queued" },
    report: { type: "json", nullable: true },
    waveforms: { type: "json", nullable: true, lazy: true },
    engineVersion: { type: "string", length: 32, nullable: true },
    ngspiceVersion: { type: "string", length: 64, nullable: true },
    modelLibraryHash: { type: "string", length: 64, nullable: true },
    models: { type: "json", nullable: true },
    modelsOutdated: { type: "boolean", default: false },
    durationMs: { type: "integer", nullable: true },
    attempts: { type: "integer", default: 0 },
    trigger: { type: "string", length: 16, default: "new-version" },
    error: { type: "text", nullable: true },
    leasedBy: { type: "string", length: 64, nullable: true },
    leaseUntil: { type: "Date", nullable: true },
    jobId: { type: "uuid", nullable: true },
    progressDone: { type: "integer", default: 0 },
    progressTotal: { type: "integer", default: 0 },
    createdAt: { type: "Date", onCreate: () => new Date() },
    startedAt: { type: "Date", nullable: true },
    finishedAt: { type: "Date", nullable: true },
  },
});
