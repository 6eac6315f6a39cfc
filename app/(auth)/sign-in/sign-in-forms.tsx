"use client";
import { signIn } from "next-auth/react";
import { useActionState, useState, type FormEvent } from "react";
import { requestLinkAction } from "@/lib/actions/sign-in";

const input = "mt-1 w-full rounded border border-rule bg-panel px-3 py-2 text-sm focus:border-copper";
const primary = "w-full rounded bg-copper px-3 py-2 text-sm font-medium text-white hover:bg-copper-dark disabled:opacity-60";

/** Password sign-in through next-auth's "password" provider, and a request for a one-time link. */
export function SignInForms({ callbackUrl, initialError }: { callbackUrl: string; initialError?: string }) {
  const [error, setError] = useState(initialError ?? "");
  const [busy, setBusy] = useState(false);
  const [link, linkAction, linkPending] = useActionState(requestLinkAction, {});

  // onSubmit rather than a form action: a failed attempt must keep what was typed (actions reset the form).
  async function withPassword(e: FormEvent<HTMLFormElement>) {
    e.preventDefault();
    const form = new FormData(e.currentTarget);
    setBusy(true);
    setError("");
    const res = await signIn("password", {
      email: String(form.get("email") ?? ""),
      password: String(form.get("password") ?? ""),
      redirect: false,
    });
    setBusy(false);
    if (!res || res.error) {
      setError(res?.error && res.error !== "CredentialsSignin" ? res.error : "That e-mail and password do not match.");
      return;
    }
    // A full load, so the header and every server component see the new session.
    window.location.assign(callbackUrl);
  }

  return (
    <div className="space-y-8">
      <form onSubmit={withPassword} className="space-y-4" aria-labelledby="pw-heading">
        <h1 id="pw-heading" className="font-serif text-2xl font-semibold">Sign in</h1>
        <label className="block text-sm font-medium">
          E-mail
          <input name="email" type="email" autoComplete="username" required className={input} />
        </label>
        <label className="block text-sm font-medium">
          Password
          <input name="password" type="password" autoComplete="current-password" required className={input} />
        </label>
        <p role="alert" aria-live="assertive" className="min-h-5 text-sm text-brick">{error}</p>
        <button type="submit" disabled={busy} className={primary}>{busy ? "Signing in…" : "Sign in"}</button>
        <p className="text-xs text-graphite">You stay signed in on this browser for 30 days, or until you sign out.</p>
      </form>

      <form action={linkAction} className="space-y-3 border-t border-rule pt-6" aria-labelledby="link-heading">
        <h2 id="link-heading" className="font-serif text-lg font-semibold">Or get a sign-in link by mail</h2>
        <label className="block text-sm font-medium">
          E-mail
          <input name="email" type="email" autoComplete="email" required className={input} />
        </label>
        <p aria-live="polite" className={`min-h-5 text-sm ${link.ok === false ? "text-brick" : "text-verdigris"}`}>{link.message}</p>
        <button type="submit" disabled={linkPending}
          className="w-full rounded border border-copper px-3 py-2 text-sm font-medium text-copper-dark hover:bg-copper-pale disabled:opacity-60">
          {linkPending ? "Sending…" : "Mail me a link"}
        </button>
      </form>
    </div>
  );
}
