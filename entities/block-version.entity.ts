import { EntitySchema, type Opt } from "@mikro-orm/core";
import type { Block } from "./block.entity";
import type { ParamSpec } from "@/checks";
import type { User } from "./user.entity";

/** A parameter as the engine parsed it, less its line in the file (the file is stored beside it). */
export type StoredParam = Omit<ParamSpec, "line">;

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
