import { UserSchema, type User } from "@/entities";
import type { Ctx } from "@/lib/context";
import { AppError } from "@/lib/errors";
import type { PasswordChangeInput, ProfileNameInput } from "@/lib/validation/accounts";
import type { Caller } from "./caller";
import { hashPassword, verifyPassword } from "./passwords";
import { currentPasswordAccepted, currentPasswordAttempt } from "./rate-limit";

function signedIn(caller: Caller) {
  if (!caller.user) throw new AppError("unauthenticated", "Sign in first.");
  // Account changes are for people at the keyboard, never for API tokens.
  if (caller.token) throw new AppError("forbidden", "API tokens cannot change accounts.");
  return caller.user;
}

/** What the settings page shows of the signed-in person. */
export async function ownProfile({ em, caller }: Ctx): Promise<Pick<User, "email" | "name"> & { hasPassword: boolean }> {
  const me = signedIn(caller);
  const user = await em.findOneOrFail(UserSchema, { id: me.id });
  return { email: user.email, name: user.name, hasPassword: !!user.passwordHash };
}

export async function updateName({ em, caller }: Ctx, { name }: ProfileNameInput): Promise<void> {
  const me = signedIn(caller);
  await em.nativeUpdate(UserSchema, { id: me.id }, { name });
}

/**
 * Sets a new password and ends every session that signed in before now, in one update. Returns that moment:
 * the browser that made the change signs in again at it (restartSession) and stays signed in.
 */
export async function changePassword({ em, caller }: Ctx, { current, next }: PasswordChangeInput, now = new Date()): Promise<Date> {
  const me = signedIn(caller);
  const user = await em.findOneOrFail(UserSchema, { id: me.id });
  if (user.passwordHash) {
    currentPasswordAttempt(me.id); // a stolen session must not be a free oracle for the password
    if (!(await verifyPassword(current, user.passwordHash))) throw new AppError("validation", "The current password is not right.");
    currentPasswordAccepted(me.id);
  }
  await em.nativeUpdate(UserSchema, { id: me.id }, { passwordHash: await hashPassword(next), sessionsValidFrom: now });
  return now;
}
