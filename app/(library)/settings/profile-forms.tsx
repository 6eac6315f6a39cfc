"use client";
import { useActionState } from "react";
import { changePasswordAction, updateNameAction } from "@/lib/actions/profile";

const input = "mt-1 w-full rounded border border-rule bg-panel px-3 py-1.5 text-sm focus:border-copper";
const button = "rounded bg-copper px-3 py-1.5 text-sm font-medium text-white hover:bg-copper-dark disabled:opacity-60";
const msg = (ok?: boolean) => `min-h-5 text-sm ${ok === false ? "text-brick" : "text-verdigris"}`;

export function NameForm({ name }: { name: string }) {
  const [state, action, pending] = useActionState(updateNameAction, {});
  return (
    <form action={action} className="space-y-3">
      <label className="block text-sm font-medium">
        Name
        <input name="name" defaultValue={name} required maxLength={200} autoComplete="name" className={input} />
      </label>
      <button type="submit" disabled={pending} className={button}>Save name</button>
      <p aria-live="polite" className={msg(state.ok)}>{state.message}</p>
    </form>
  );
}

export function PasswordForm({ hasPassword }: { hasPassword: boolean }) {
  const [state, action, pending] = useActionState(changePasswordAction, {});
  return (
    <form action={action} className="space-y-3">
      {hasPassword ? (
        <label className="block text-sm font-medium">
          Current password
          <input name="current" type="password" required autoComplete="current-password" className={input} />
        </label>
      ) : (
        <input type="hidden" name="current" value="" />
      )}
      <label className="block text-sm font-medium">
        New password <span className="font-normal text-graphite">(at least 10 characters)</span>
        <input name="next" type="password" required minLength={10} autoComplete="new-password" className={input} />
      </label>
      <label className="block text-sm font-medium">
        New password again
        <input name="repeat" type="password" required minLength={10} autoComplete="new-password" className={input} />
      </label>
      <p className="text-sm text-graphite">Changing it signs you out in every other browser and device; this one stays signed in.</p>
      <button type="submit" disabled={pending} className={button}>Change password</button>
      <p aria-live="polite" className={msg(state.ok)}>{state.message}</p>
    </form>
  );
}
