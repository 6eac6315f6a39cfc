import { SignInLinkSchema, UserSchema } from "@/entities";
import type { Ctx } from "@/lib/context";
import { AppError } from "@/lib/errors";
import { sendMail } from "@/lib/mail/mailer";
import { signInLinkMessage } from "@/lib/mail/messages";
import { randomSecret, sha256Hex } from "@/lib/tokens/secret";
import type { LinkRequestInput, LinkToken, PasswordSignInInput } from "@/lib/validation/accounts";
import { hashPassword, verifyPassword } from "./passwords";
import { clientIp, linkRedeemAttempt, linkRequest, passwordAccepted, passwordAttempt } from "./rate-limit";

export const LINK_MINUTES = 15;

export interface SignedIn {
  id: string;
  email: string;
  name: string;
}

export const normaliseEmail = (email: string): string => email.trim().toLowerCase();

// Compared against when the address is unknown, so a wrong address costs as long as a wrong password.
let decoyHash: Promise<string> | undefined;

/** E-mail + password; the same refusal for an unknown address and a wrong password. */
/** `ip` is the client's IP when a trusted proxy names it (clientIp), else null: then only the account is slowed. */
export async function authorizePassword({ em }: Ctx, { email, password }: PasswordSignInInput, ip: string | null): Promise<SignedIn> {
  const address = normaliseEmail(email);
  passwordAttempt(address, ip);
  const user = await em.findOne(UserSchema, { email: address });
  decoyHash ??= hashPassword(randomSecret(16));
  const ok = await verifyPassword(password, user?.passwordHash ?? (await decoyHash));
  if (!user || !user.passwordHash || !ok) throw new AppError("unauthenticated", "That e-mail and password do not match.");
  passwordAccepted(address);
  return { id: String(user.id), email: user.email, name: user.name };
}

/**
 * Mails a one-time sign-in link when the address belongs to someone; says nothing either way,
 * so the form cannot be used to find out who has an account.
 */
export async function requestSignInLink({ em }: Ctx, { email }: LinkRequestInput, ip: string | null, now = new Date()): Promise<void> {
  const address = normaliseEmail(email);
  await linkRequest(address, ip);
  const user = await em.findOne(UserSchema, { email: address });
  if (!user) return;
  const token = randomSecret(32);
  em.create(SignInLinkSchema, {
    email: user.email,
    tokenHash: sha256Hex(token),
    expiresAt: new Date(now.getTime() + LINK_MINUTES * 60_000),
    usedAt: null,
    createdAt: now,
  });
  await em.flush();
  await sendMail({ to: user.email, ...signInLinkMessage(token, LINK_MINUTES) });
}

/** Redeems a link once: the conditional update is the single-use guarantee even when two tabs race. */
export async function redeemSignInLink({ em }: Ctx, { token }: LinkToken, ip: string | null, now = new Date()): Promise<SignedIn> {
  linkRedeemAttempt(ip);
  const refused = new AppError("unauthenticated", "This sign-in link is not valid any more. Ask for a new one.");
  if (!/^[A-Za-z0-9_-]{20,100}$/.test(token)) throw refused;
  const hash = sha256Hex(token);
  const taken = await em.nativeUpdate(
    SignInLinkSchema,
    { tokenHash: hash, usedAt: null, expiresAt: { $gt: now } },
    { usedAt: now },
  );
  if (taken !== 1) throw refused;
  const row = await em.findOneOrFail(SignInLinkSchema, { tokenHash: hash });
  const user = await em.findOne(UserSchema, { email: row.email });
  if (!user) throw refused;
  return { id: String(user.id), email: user.email, name: user.name };
}

export { clientIp };
