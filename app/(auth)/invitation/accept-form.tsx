"use client";
import { signIn } from "next-auth/react";
import { useState, type FormEvent } from "react";

const input = "mt-1 w-full rounded border border-rule bg-panel px-3 py-2 text-sm focus:border-copper";

/** Accepting signs in through next-auth's "invitation" provider; a new account gives a name and a password. */
export function AcceptForm({ token, hasAccount, teamName }: { token: string; hasAccount: boolean; teamName: string }) {
  const [error, setError] = useState("");
  const [busy, setBusy] = useState(false);
  // onSubmit rather than a form action, so a refusal keeps what was typed.
  async function accept(e: FormEvent<HTMLFormElement>) {
    e.preventDefault();
    const form = new FormData(e.currentTarget);
    setError("");
    const name = String(form.get("name") ?? "");
    const password = String(form.get("password") ?? "");
    if (!hasAccount && password !== String(form.get("repeat") ?? "")) return setError("The two passwords differ.");
    setBusy(true);
    const res = await signIn("invitation", { token, name, password, redirect: false });
    setBusy(false);
    if (!res || res.error) return setError(res?.error && res.error !== "CredentialsSignin" ? res.error : "The invitation could not be accepted.");
    window.location.assign("/");
  }
  return (
    <form onSubmit={accept} className="space-y-4">
      {hasAccount ? null : (
        <>
          <label className="block text-sm font-medium">
            Your name
            <input name="name" autoComplete="name" required maxLength={200} className={input} />
          </label>
          <label className="block text-sm font-medium">
            Password <span className="font-normal text-graphite">(at least 10 characters)</span>
            <input name="password" type="password" autoComplete="new-password" required minLength={10} className={input} />
          </label>
          <label className="block text-sm font-medium">
            Password again
            <input name="repeat" type="password" autoComplete="new-password" required minLength={10} className={input} />
          </label>
        </>
      )}
      <p role="alert" aria-live="assertive" className="min-h-5 text-sm text-brick">{error}</p>
      <button type="submit" disabled={busy}
        className="w-full rounded bg-copper px-3 py-2 text-sm font-medium text-white hover:bg-copper-dark disabled:opacity-60">
        {busy ? "Joining…" : hasAccount ? `Join ${teamName}` : `Create the account and join ${teamName}`}
      </button>
    </form>
  );
}
