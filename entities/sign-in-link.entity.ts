import { EntitySchema, type Opt } from "@mikro-orm/core";

// One-time e-mail sign-in links; redeemed through a Credentials provider with JWT sessions.
export interface SignInLink {
  id: number;
  email: string;
  tokenHash: string;
  expiresAt: Date;
  usedAt: Date | null;
  createdAt: Opt<Date>;
}

export const SignInLinkSchema = new EntitySchema<SignInLink>({
  name: "SignInLink",
  tableName: "sign_in_links",
  properties: {
    id: { type: "integer", primary: true, autoincrement: true },
    email: { type: "string", length: 320, index: true },
    tokenHash: { type: "string", length: 64, unique: true },
    expiresAt: { type: "Date" },
    usedAt: { type: "Date", nullable: true },
    createdAt: { type: "Date", onCreate: () => new Date() },
  },
});
