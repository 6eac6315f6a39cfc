"use client";
import { signOut } from "next-auth/react";
import { useState } from "react";

export function SignOutButton() {
  const [busy, setBusy] = useState(false);
  return (
    <button type="button" disabled={busy} onClick={() => { setBusy(true); void signOut({ callbackUrl: "/" }); }}
      className="w-full rounded bg-copper px-3 py-2 text-sm font-medium text-white hover:bg-copper-dark disabled:opacity-60">
      {busy ? "Signing out…" : "Sign out"}
    </button>
  );
}
