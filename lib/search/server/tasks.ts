import type { MeiliErrorBody } from "./errors";

export type TaskStatus = "enqueued" | "processing" | "succeeded" | "failed" | "canceled";
export type TaskType = "indexCreation" | "indexUpdate" | "indexDeletion" | "documentAdditionOrUpdate" | "documentDeletion" | "settingsUpdate";

// Meilisearch's task object as GET /tasks/{uid} returns it.
export interface TaskRecord {
  uid: number;
  batchUid: number | null;
  indexUid: string | null;
  status: TaskStatus;
  type: TaskType;
  canceledBy: number | null;
  details: Record<string, unknown>;
  error: MeiliErrorBody | null;
  duration: string | null;
  enqueuedAt: string;
  startedAt: string | null;
  finishedAt: string | null;
}

export type TaskPayload =
  | { kind: "createIndex"; primaryKey: string | null }
  | { kind: "updateIndex"; primaryKey: string | null }
  | { kind: "deleteIndex" }
  | { kind: "addDocuments"; documents: Record<string, unknown>[]; mode: "replace" | "update"; primaryKey?: string }
  | { kind: "deleteDocuments"; ids: string[] }
  | { kind: "deleteByFilter"; filter: unknown }
  | { kind: "clearDocuments" }
  | { kind: "updateSettings"; settings: Record<string, unknown> };

export interface PendingTask {
  task: TaskRecord;
  payload: TaskPayload;
}

// The 202 body for an accepted task.
export function summary(t: TaskRecord) {
  return { taskUid: t.uid, indexUid: t.indexUid, status: t.status, type: t.type, enqueuedAt: t.enqueuedAt };
}

export function isoDuration(ms: number): string {
  return `PT${(ms / 1000).toFixed(6)}S`;
}

export function newTask(uid: number, indexUid: string, type: TaskType, details: Record<string, unknown>): TaskRecord {
  return {
    uid,
    batchUid: null,
    indexUid,
    status: "enqueued",
    type,
    canceledBy: null,
    details,
    error: null,
    duration: null,
    enqueuedAt: new Date().toISOString(),
    startedAt: null,
    finishedAt: null,
  };
}
