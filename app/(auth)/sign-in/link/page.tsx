import type { Metadata } from "next";
import Link from "next/link";
import { RedeemLink } from "./redeem-link";

export const metadata: Metadata = { title: "Sign in with a link" };
export const dynamic = "force-dynamic";

export default async function SignInLinkPage({ searchParams }: { searchParams: Promise<{ token?: string }> }) {
  const { token } = await searchParams;
  if (!token) {
    return (
      <div className="space-y-3">
        <h1 className="font-serif text-2xl font-semibold">No link to redeem</h1>
        <p className="text-sm text-graphite">Open the link from your mail, or <Link href="/sign-in" className="text-copper-dark underline">ask for a new one</Link>.</p>
      </div>
    );
  }
  return <RedeemLink token={token} />;
}
