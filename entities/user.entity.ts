import { EntitySchema, type Opt } from "@mikro-orm/core";

export interface User {
  id: number;
  email: string;
  name: string;
  passwordHash: string | null;
  /** Session cookies that signed in before this moment are refused (set by a password change). */
  sessionsValidFrom: Date | null;
  createdAt: Opt<Date>;
}

export const UserSchema = new EntitySchema<User>({
  name: "User",
  tableName: "users",
  properties: {
    id: { type: "integer", primary: true, autoincrement: true },
    email: { type: "string", length: 320, unique: true },
    name: { type: "string", length: 200 },
    passwordHash: { type: "string", nullable: true },
    sessionsValidFrom: { type: "Date", nullable: true },
    createdAt: { type: "Date", onCreate: () => new Date() },
  },
});
