import { EntitySchema } from "@mikro-orm/core";

// A signed-out session: its cookie (a JWT that lives on until it expires) no longer counts. Kept until then.
export interface EndedSession {
  sid: string;
  userId: number;
  endedAt: Date;
  expiresAt: Date;
}

export const EndedSessionSchema = new EntitySchema<EndedSession>({
  name: "EndedSession",
  tableName: "ended_sessions",
  properties: {
    sid: { type: "uuid", primary: true },
    userId: { type: "integer" },
    endedAt: { type: "Date" },
    expiresAt: { type: "Date", index: true },
  },
});
