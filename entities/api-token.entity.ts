import { EntitySchema, type Opt } from "@mikro-orm/core";
import type { Team } from "./team.entity";
import type { User } from "./user.entity";

export type TokenScope = "read" | "write";

// The token itself is shown once; `hash` is its sha256, `prefix` lets people tell tokens apart.
export interface ApiToken {
  id: number;
  user: User;
  team: Team;
  name: string;
  hash: string;
  prefix: string;
  scope: TokenScope;
  expiresAt: Date | null;
  lastUsedAt: Date | null;
  revokedAt: Date | null;
  createdAt: Opt<Date>;
}

export const ApiTokenSchema = new EntitySchema<ApiToken>({
  name: "ApiToken",
  tableName: "api_tokens",
  properties: {
    id: { type: "integer", primary: true, autoincrement: true },
    user: { kind: "m:1", entity: "User", deleteRule: "cascade" },
    team: { kind: "m:1", entity: "Team", deleteRule: "cascade" },
    name: { type: "string", length: 100 },
    hash: { type: "string", length: 64, unique: true },
    prefix: { type: "string", length: 16 },
    scope: { type: "string", length: 8 },
    expiresAt: { type: "Date", nullable: true },
    lastUsedAt: { type: "Date", nullable: true },
    revokedAt: { type: "Date", nullable: true },
    createdAt: { type: "Date", onCreate: () => new Date() },
  },
});
