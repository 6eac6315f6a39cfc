import { EntitySchema, type Opt } from "@mikro-orm/core";
import type { Team } from "./team.entity";
import type { User } from "./user.entity";

export const ROLES = ["viewer", "author", "maintainer", "admin"] as const;
export type Role = (typeof ROLES)[number];

export interface Membership {
  id: number;
  user: User;
  team: Team;
  role: Role;
  createdAt: Opt<Date>;
}

export const MembershipSchema = new EntitySchema<Membership>({
  name: "Membership",
  tableName: "memberships",
  uniques: [{ properties: ["user", "team"] }],
  properties: {
    id: { type: "integer", primary: true, autoincrement: true },
    user: { kind: "m:1", entity: "User", deleteRule: "cascade" },
    team: { kind: "m:1", entity: "Team", deleteRule: "cascade" },
    role: { type: "string", length: 16 },
    createdAt: { type: "Date", onCreate: () => new Date() },
  },
});
