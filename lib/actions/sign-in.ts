"use server";
import "server-only";
import { headers } from "next/headers";
import { clientIp } from "@/lib/auth/rate-limit";
import { requestSignInLink } from "@/lib/auth/sign-in";
import { contextFor } from "@/lib/context";
import { isAppError } from "@/lib/errors";
import { firstIssue, linkRequest } from "@/lib/validation/accounts";

export interface LinkState {
  ok?: boolean;
  message?: string;
}

/** Mails a sign-in link; the answer is the same whether or not the address has an account. */
export async function requestLinkAction(_prev: LinkState, form: FormData): Promise<LinkState> {
  const parsed = linkRequest.safeParse({ email: form.get("email") });
  if (!parsed.success) return { ok: false, message: firstIssue(parsed.error) };
  try {
    const ip = clientIp(await headers());
    await requestSignInLink(await contextFor(), parsed.data, ip);
  } catch (err) {
    if (isAppError(err)) return { ok: false, message: err.message };
    console.error(err);
    return { ok: false, message: "The link could not be sent just now. Try again, or sign in with your password." };
  }
  return { ok: true, message: `If ${parsed.data.email} has an account, a sign-in link is on its way. It works once, for 15 minutes.` };
}
