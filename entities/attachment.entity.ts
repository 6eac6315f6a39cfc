import { EntitySchema, type Opt } from "@mikro-orm/core";
import type { Block } from "./block.entity";
import type { User } from "./user.entity";

// Schematic images for notes; bytes live in the database so backups hold everything.
export interface Attachment {
  id: number;
  block: Block;
  name: string;
  contentType: string;
  size: number;
  sha256: string;
  bytes: Buffer;
  uploadedBy: User;
  createdAt: Opt<Date>;
}

export const AttachmentSchema = new EntitySchema<Attachment>({
  name: "Attachment",
  tableName: "attachments",
  uniques: [{ properties: ["block", "name"] }],
  properties: {
    id: { type: "integer", primary: true, autoincrement: true },
    block: { kind: "m:1", entity: "Block", deleteRule: "cascade" },
    name: { type: "string", length: 200 },
    contentType: { type: "string", length: 100 },
    size: { type: "integer" },
    sha256: { type: "string", length: 64 },
    bytes: { type: "blob", lazy: true },
    uploadedBy: { kind: "m:1", entity: "User" },
    createdAt: { type: "Date", onCreate: () => new Date() },
  },
});
