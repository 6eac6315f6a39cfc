import { EntitySchema, type Opt } from "@mikro-orm/core";
import type { BlockVersion } from "./block-version.entity";
import type { Team } from "./team.entity";

export const CATEGORIES = ["oscillator", "limiter", "filter", "amplifier", "reference", "power", "interface", "other"] as const;
export type Category = (typeof CATEGORIES)[number];
export const VISIBILITIES = ["team", "public"] as const;
export type Visibility = (typeof VISIBILITIES)[number];

// Title, category, tags and summary are copied from the head version so lists need no join.
export interface Block {
  id: number;
  slug: string;
  team: Team;
  title: string;
  summary: string;
  category: Category;
  tags: string[];
  hazard: string[];
  visibility: Visibility;
  head: BlockVersion | null;
  forkedFrom: BlockVersion | null;
  archived: boolean;
  createdAt: Opt<Date>;
  updatedAt: Opt<Date>;
}

export const BlockSchema = new EntitySchema<Block>({
  name: "Block",
  tableName: "blocks",
  properties: {
    id: { type: "integer", primary: true, autoincrement: true },
    slug: { type: "string", length: 100, unique: true },
    team: { kind: "m:1", entity: "Team" },
    title: { type: "string", length: 200 },
    summary: { type: "text", default: "" },
    category: { type: "string", length: 16 },
    tags: { type: "json", default: "[]" },
    hazard: { type: "json", default: "[]" },
    visibility: { type: "string", length: 8, default: "team" },
    head: { kind: "m:1", entity: "BlockVersion", nullable: true, deleteRule: "set null" },
    forkedFrom: { kind: "m:1", entity: "BlockVersion", nullable: true, deleteRule: "set null" },
    archived: { type: "boolean", default: false },
    createdAt: { type: "Date", onCreate: () => new Date() },
    updatedAt: { type: "Date", onCreate: () => new Date(), onUpdate: () => new Date() },
  },
});
