import { EntitySchema, type Opt } from "@mikro-orm/core";
import type { ModelVersion } from "./model-version.entity";
import type { Team } from "./team.entity";

// A team's model file, by the name blocks `.include`; its text lives in immutable versions, the head is the newest.
export interface Model {
  id: number;
  team: Team;
  name: string;
  head: ModelVersion | null;
  createdAt: Opt<Date>;
  updatedAt: Opt<Date>;
}

export const ModelSchema = new EntitySchema<Model>({
  name: "Model",
  tableName: "models",
  uniques: [{ properties: ["team", "name"] }],
  properties: {
    id: { type: "integer", primary: true, autoincrement: true },
    team: { kind: "m:1", entity: "Team", deleteRule: "cascade" },
    name: { type: "string", length: 100 },
    head: { kind: "m:1", entity: "ModelVersion", nullable: true, deleteRule: "set null" },
    createdAt: { type: "Date", onCreate: () => new Date() },
    updatedAt: { type: "Date", onCreate: () => new Date(), onUpdate: () => new Date() },
  },
});
