import { z } from "zod";
import { ROLES } from "@/entities";
import { SLUG_RE } from "./api";

// Form and CLI input for accounts, teams and tokens; services re-check rights, these only check shape.
export const email = z.string().trim().toLowerCase().email("Enter an e-mail address.").max(320);
export const password = z.string().min(10, "Use at least 10 characters.").max(200, "Use at most 200 characters.");
export const personName = z.string().trim().min(1, "Enter your name.").max(200);
export const role = z.enum(ROLES);
export const teamSlug = z.string().trim().max(64, "Not a team slug.").regex(SLUG_RE, "Not a team slug.");

export const passwordSignIn = z.object({ email, password: z.string().min(1, "Enter your password.").max(200) });
export const linkRequest = z.object({ email });
export const invitation = z.object({ teamSlug, email, role });
export const acceptInvitation = z.object({
  token: z.string().min(20).max(100),
  name: personName.optional(),
  password: password.optional(),
});
export const profileName = z.object({ name: personName });
/** A team by slug (the team page). */
export const teamRef = z.object({ teamSlug });
/** One member of a team, and the role an admin gives them. */
export const memberTarget = z.object({ teamSlug, userId: z.coerce.number().int().positive() });
export const roleChange = memberTarget.extend({ role });
/** One pending invitation of a team. */
export const invitationRef = z.object({ teamSlug, id: z.coerce.number().int().positive() });
/** The secret in an invitation link, as the acceptance page reads it. */
export const invitationToken = z.object({ token: z.string().regex(/^[A-Za-z0-9_-]{20,100}$/) });
export const passwordChange = z
  .object({ current: z.string().max(200), next: password, repeat: z.string() })
  .refine((v) => v.next === v.repeat, { message: "The two new passwords differ.", path: ["repeat"] });

export const TOKEN_EXPIRY_DAYS = [7, 30, 90, 365, 0] as const; // 0 = never
export const newToken = z.object({
  name: z.string().trim().min(1, "Name the token, e.g. after the script that uses it.").max(100),
  teamSlug,
  scope: z.enum(["read", "write"]),
  expiresInDays: z.coerce.number().int().refine((d) => (TOKEN_EXPIRY_DAYS as readonly number[]).includes(d), "Pick an expiry."),
});
/** One token of the settings page's list. */
export const tokenRef = z.object({ id: z.coerce.number().int().positive() });

export type NewTokenInput = z.infer<typeof newToken>;
export type PasswordSignInInput = z.infer<typeof passwordSignIn>;
export type LinkRequestInput = z.infer<typeof linkRequest>;
/** A sign-in link's or an invitation's secret, as the link carries it (checked by the service, which refuses in words). */
export type LinkToken = { token: string };
export type InvitationInput = z.infer<typeof invitation>;
export type AcceptInvitationInput = z.infer<typeof acceptInvitation>;
export type InvitationTokenInput = z.infer<typeof invitationToken>;
export type ProfileNameInput = z.infer<typeof profileName>;
export type PasswordChangeInput = Pick<z.infer<typeof passwordChange>, "current" | "next">;
export type TeamRef = z.infer<typeof teamRef>;
export type MemberTarget = z.infer<typeof memberTarget>;
export type RoleChange = z.infer<typeof roleChange>;
export type InvitationRef = z.infer<typeof invitationRef>;
export type TokenRef = z.infer<typeof tokenRef>;

/** First message of a zod error, for a form's one-line answer. */
export const firstIssue = (e: z.ZodError): string => e.issues[0]?.message ?? "Invalid input.";
