import { EntitySchema, type Opt } from "@mikro-orm/core";
import type { Role } from "./membership.entity";
import type { Team } from "./team.entity";
import type { User } from "./user.entity";

// The link carries a random token; only its hash is stored so a database leak cannot be redeemed.
export interface Invitation {
  id: number;
  team: Team;
  email: string;
  role: Role;
  tokenHash: string;
  invitedBy: User;
  expiresAt: Date;
  acceptedAt: Date | null;
  createdAt: Opt<Date>;
}

export const InvitationSchema = new EntitySchema<Invitation>({
  name: "Invitation",
  tableName: "invitations",
  properties: {
    id: { type: "integer", primary: true, autoincrement: true },
    team: { kind: "m:1", entity: "Team", deleteRule: "cascade" },
    email: { type: "string", length: 320 },
    role: { type: "string", length: 16 },
    tokenHash: { type: "string", length: 64, unique: true },
    invitedBy: { kind: "m:1", entity: "User" },
    expiresAt: { type: "Date" },
    acceptedAt: { type: "Date", nullable: true },
    createdAt: { type: "Date", onCreate: () => new Date() },
  },
});
