import { EntitySchema, type Opt } from "@mikro-orm/core";
import type { Block } from "./block.entity";
import type { User } from "./user.entity";

export interface Watch {
  id: number;
  user: User;
  block: Block;
  createdAt: Opt<Date>;
}

export const WatchSchema = new EntitySchema<Watch>({
  name: "Watch",
  tableName: "watches",
  uniques: [{ properties: ["user", "block"] }],
  properties: {
    id: { type: "integer", primary: true, autoincrement: true },
    user: { kind: "m:1", entity: "User", deleteRule: "cascade" },
    block: { kind: "m:1", entity: "Block", deleteRule: "cascade" },
    createdAt: { type: "Date", onCreate: () => new Date() },
  },
});
