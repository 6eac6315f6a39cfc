import type { Metadata } from "next";
import { redirect } from "next/navigation";
import { getCaller } from "@/lib/auth/session";
import { safePath } from "../safe-path";
import { SignInForms } from "./sign-in-forms";

export const metadata: Metadata = { title: "Sign in" };
export const dynamic = "force-dynamic";

// next-auth sends its own failures here as ?error=…; a credentials refusal arrives as our message.
const known: Record<string, string> = {
  CredentialsSignin: "That e-mail and password do not match.",
  SessionRequired: "Sign in to see that page.",
};

export default async function SignInPage({ searchParams }: { searchParams: Promise<Record<string, string | undefined>> }) {
  const q = await searchParams;
  const callbackUrl = safePath(q.callbackUrl);
  if ((await getCaller()).user) redirect(callbackUrl);
  const error = q.error ? (known[q.error] ?? (q.error.length < 200 ? q.error : "Sign-in failed.")) : undefined;
  return <SignInForms callbackUrl={callbackUrl} initialError={error} />;
}
