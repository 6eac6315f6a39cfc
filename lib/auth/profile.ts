import type { EntityManager } from "@mikro-orm/postgresql";
import { UserSchema } from "@/entities";
import { AppError } from "@/lib/errors";
import type { Caller } from "./caller";
import { hashPassword, verifyPassword } from "./passwords";

function signedIn(caller: Caller) {
  if (!caller.user) throw new AppError("unauthenticated", "Sign in first.");
  // Account changes are for people at the keyboard, never for API tokens.
  if (caller.token) throw new AppError("forbidden", "API tokens cannot change accounts.");
  return caller.user;
}

export async function updateName(em: EntityManager, caller: Caller, name: string): Promise<void> {
  const me = signedIn(caller);
  await em.nativeUpdate(UserSchema, { id: me.id }, { name: name.trim() });
}

export async function changePassword(em: EntityManager, caller: Caller, current: string, next: string): Promise<void> {
  const me = signedIn(caller);
  const user = await em.findOneOrFail(UserSchema, { id: me.id });
  if (user.passwordHash && !(await verifyPassword(current, user.passwordHash))) {
    throw new AppError("validation", "The current password is not right.");
  }
  await em.nativeUpdate(UserSchema, { id: me.id }, { passwordHash: await hashPassword(next) });
}
