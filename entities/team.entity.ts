import { EntitySchema, type Opt } from "@mikro-orm/core";

export interface Team {
  id: number;
  slug: string;
  name: string;
  createdAt: Opt<Date>;
}

export const TeamSchema = new EntitySchema<Team>({
  name: "Team",
  tableName: "teams",
  properties: {
    id: { type: "integer", primary: true, autoincrement: true },
    slug: { type: "string", length: 64, unique: true },
    name: { type: "string", length: 200 },
    createdAt: { type: "Date", onCreate: () => new Date() },
  },
});
