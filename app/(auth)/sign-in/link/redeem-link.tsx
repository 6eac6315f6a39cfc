"use client";
import { signIn } from "next-auth/react";
import Link from "next/link";
import { useState } from "react";

/**
 * Redeeming takes a click: mail scanners that open links must not use up the one-time token.
 */
export function RedeemLink({ token }: { token: string }) {
  const [error, setError] = useState("");
  const [busy, setBusy] = useState(false);
  async function go() {
    setBusy(true);
    const res = await signIn("link", { token, redirect: false });
    setBusy(false);
    if (!res || res.error) return setError(res?.error && res.error !== "CredentialsSignin" ? res.error : "This sign-in link is not valid any more.");
    window.location.assign("/");
  }
  return (
    <div className="space-y-4">
      <h1 className="font-serif text-2xl font-semibold">Sign in with your link</h1>
      <p className="text-sm text-graphite">The link works once and for 15 minutes after it was sent.</p>
      <button type="button" onClick={go} disabled={busy}
        className="w-full rounded bg-copper px-3 py-2 text-sm font-medium text-white hover:bg-copper-dark disabled:opacity-60">
        {busy ? "Signing in…" : "Sign in to Assay"}
      </button>
      <p role="alert" aria-live="assertive" className="min-h-5 text-sm text-brick">{error}</p>
      {error ? <p className="text-sm"><Link href="/sign-in" className="text-copper-dark underline">Ask for a new link</Link></p> : null}
    </div>
  );
}
