import type { ReactNode } from "react";
import Link from "next/link";
import { Wordmark } from "@/components/wordmark";

// Sign-in, links, invitations and sign-out: one narrow card on the paper surface, no library chrome.
export default function AuthLayout({ children }: { children: ReactNode }) {
  return (
    <div className="flex min-h-screen flex-col items-center px-4 pt-16 pb-10">
      <Link href="/" aria-label="Assay, the library" className="mb-8"><Wordmark /></Link>
      <main id="main" className="w-full max-w-md rounded border border-rule bg-panel p-6 shadow-sm">{children}</main>
    </div>
  );
}
