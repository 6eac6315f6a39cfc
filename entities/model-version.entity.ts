import { EntitySchema, type Opt } from "@mikro-orm/core";
import type { ModelDefinition } from "@/checks";
import type { Model } from "./model.entity";
import type { User } from "./user.entity";

// Immutable: every upload of a name is the next number; runs pin the sha256 of what they simulated.
export interface ModelVersion {
  id: number;
  model: Model;
  number: number;
  text: string;
  sha256: string;
  /** The `.subckt` and `.model` names the file defines, read at upload. */
  defines: ModelDefinition[];
  author: User;
  message: string;
  createdAt: Opt<Date>;
}

export const ModelVersionSchema = new EntitySchema<ModelVersion>({
  name: "ModelVersion",
  tableName: "model_versions",
  uniques: [{ properties: ["model", "number"] }],
  properties: {
    id: { type: "integer", primary: true, autoincrement: true },
    model: { kind: "m:1", entity: "Model", deleteRule: "cascade" },
    number: { type: "integer" },
    text: { type: "text" },
    sha256: { type: "string", length: 64, index: true },
    defines: { type: "json" },
    author: { kind: "m:1", entity: "User" },
    message: { type: "text", default: "" },
    createdAt: { type: "Date", onCreate: () => new Date() },
  },
});
