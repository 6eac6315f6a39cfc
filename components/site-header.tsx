import Link from "next/link";
import { getCaller } from "@/lib/auth/session";
import { sinkDir } from "@/lib/mail/mailbox";
import { isMailboxViewer } from "@/lib/mail/mailbox-access";
import { HeaderSearch } from "./header-search";
import { Wordmark } from "./wordmark";

const NAV = [
  { href: "/", label: "Library" },
  { href: "/reviews", label: "Reviews" },
  { href: "/models", label: "Models" },
  { href: "/import", label: "Import" },
  { href: "/team", label: "Team" },
  { href: "/settings", label: "Settings" },
];
// Signed out, the rest would only send you to the sign-in page.
const PUBLIC_NAV = [
  { href: "/", label: "Library" },
  { href: "/api-docs", label: "API reference" },
];

export async function SiteHeader() {
  const caller = await getCaller();
  // The mailbox exists only while the local mail sink stands in for SMTP, and only team admins may read it.
  const nav = !caller.user ? PUBLIC_NAV : sinkDir() && isMailboxViewer(caller) ? [...NAV, { href: "/mailbox", label: "Mailbox" }] : NAV;
  return (
    <header className="border-b border-rule bg-panel/80">
      <div className="mx-auto flex max-w-7xl flex-wrap items-center gap-x-6 gap-y-2 px-4 py-2 sm:px-6">
        <Link href="/" aria-label="Assay, the library" className="shrink-0"><Wordmark /></Link>
        <nav aria-label="Main" className="order-3 w-full sm:order-none sm:w-auto">
          <ul className="flex flex-wrap gap-x-4 gap-y-1 text-sm">
            {nav.map((n) => (
              <li key={n.href}><Link href={n.href} className="text-graphite hover:text-copper-dark">{n.label}</Link></li>
            ))}
          </ul>
        </nav>
        <div className="ml-auto flex items-center gap-3 text-sm">
          <HeaderSearch />
          {caller.user ? (
            <>
              <span className="hidden text-graphite md:inline" data-testid="signed-in-as">{caller.user.name}</span>
              <Link href="/sign-out" className="text-copper-dark hover:underline">Sign out</Link>
            </>
          ) : (
            <Link href="/sign-in" className="rounded bg-copper px-3 py-1 font-medium text-white hover:bg-copper-dark">Sign in</Link>
          )}
        </div>
      </div>
    </header>
  );
}
