import { EntitySchema, type Opt } from "@mikro-orm/core";

export type OutboxKind =
  | "version.created"
  | "run.finished"
  | "block.archived"
  | "block.updated"
  | "review.requested"
  | "review.decided";

// Written in the same transaction as the change; each consumer marks its own column when done.
export interface OutboxEvent {
  id: number;
  kind: OutboxKind;
  payload: Record<string, unknown>;
  createdAt: Opt<Date>;
  indexedAt: Date | null;
  notifiedAt: Date | null;
}

export const OutboxEventSchema = new EntitySchema<OutboxEvent>({
  name: "OutboxEvent",
  tableName: "outbox_events",
  indexes: [{ properties: ["indexedAt"] }, { properties: ["notifiedAt"] }],
  properties: {
    id: { type: "integer", primary: true, autoincrement: true },
    kind: { type: "string", length: 32 },
    payload: { type: "json" },
    createdAt: { type: "Date", onCreate: () => new Date() },
    indexedAt: { type: "Date", nullable: true },
    notifiedAt: { type: "Date", nullable: true },
  },
});
