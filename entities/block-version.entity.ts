import { EntitySchema, type Opt } from "@mikro-orm/core";
import type { Block } from "./block.entity";
import type { User } from "./user.entity";

export interface StoredParam {
  name: string;
  value: string;
  tol?: string;
  note?: string;
  si: number;
  unit: string;
}

// Immutable: a change of anything is a new version with the next number.
export interface BlockVersion {
  id: number;
  block: Block;
  number: number;
  text: string;
  params: StoredParam[];
  contentHash: string;
  author: User;
  message: string;
  createdAt: Opt<Date>;
}

export const BlockVersionSchema = new EntitySchema<BlockVersion>({
  name: "BlockVersion",
  tableName: "block_versions",
  uniques: [{ properties: ["block", "number"] }],
  properties: {
    id: { type: "integer", primary: true, autoincrement: true },
    block: { kind: "m:1", entity: "Block", deleteRule: "cascade" },
    number: { type: "integer" },
    text: { type: "text" },
    params: { type: "json" },
    contentHash: { type: "string", length: 64, index: true },
    author: { kind: "m:1", entity: "User" },
    message: { type: "text", default: "" },
    createdAt: { type: "Date", onCreate: () => new Date() },
  },
});
