import type { Metadata } from "next";
import Link from "next/link";
import { describeInvitation } from "@/lib/auth/invitations";
import { contextFor } from "@/lib/context";
import { invitationToken } from "@/lib/validation/accounts";
import { AcceptForm } from "./accept-form";

export const metadata: Metadata = { title: "Invitation" };
export const dynamic = "force-dynamic";

export default async function InvitationPage({ searchParams }: { searchParams: Promise<{ token?: string }> }) {
  const { token } = await searchParams;
  const link = invitationToken.safeParse({ token });
  // Whoever follows the link is not signed in yet: an anonymous context.
  const inv = link.success ? await describeInvitation(await contextFor(), link.data) : null;
  if (!token || !inv) {
    return (
      <div className="space-y-3">
        <h1 className="font-serif text-2xl font-semibold">This invitation is not valid any more</h1>
        <p className="text-sm text-graphite">It was used already, withdrawn, or is older than seven days. Ask the team&apos;s admin to invite you again.</p>
        <p className="text-sm"><Link href="/sign-in" className="text-copper-dark underline">Sign in</Link></p>
      </div>
    );
  }
  return (
    <div className="space-y-4">
      <h1 className="font-serif text-2xl font-semibold">Join {inv.teamName}</h1>
      <p className="text-sm text-graphite">
        You are invited as <strong className="text-ink">{inv.role}</strong>, with the address <span className="font-mono">{inv.email}</span>.
        {inv.hasAccount ? " You already have an account: accepting adds this team to it and signs you in." : " Choose your name and a password for your new account."}
      </p>
      <AcceptForm token={token} hasAccount={inv.hasAccount} teamName={inv.teamName} />
    </div>
  );
}
