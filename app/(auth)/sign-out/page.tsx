import type { Metadata } from "next";
import Link from "next/link";
import { getCaller } from "@/lib/auth/session";
import { SignOutButton } from "./sign-out-button";

export const metadata: Metadata = { title: "Sign out" };
export const dynamic = "force-dynamic";

export default async function SignOutPage() {
  const caller = await getCaller();
  if (!caller.user) {
    return (
      <div className="space-y-3">
        <h1 className="font-serif text-2xl font-semibold">Signed out</h1>
        <p className="text-sm"><Link href="/" className="text-copper-dark underline">Back to the library</Link> · <Link href="/sign-in" className="text-copper-dark underline">Sign in</Link></p>
      </div>
    );
  }
  return (
    <div className="space-y-4">
      <h1 className="font-serif text-2xl font-semibold">Sign out</h1>
      <p className="text-sm text-graphite">Signed in as {caller.user.name} ({caller.user.email}). Signing out ends the session on this browser; API tokens keep working until revoked.</p>
      <SignOutButton />
    </div>
  );
}
