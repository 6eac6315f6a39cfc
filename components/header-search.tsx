"use client";
import { usePathname, useRouter } from "next/navigation";
import { useState } from "react";

/** The header's search: on the library page the big search box takes over, elsewhere this one jumps there. */
export function HeaderSearch() {
  const pathname = usePathname();
  const router = useRouter();
  const [q, setQ] = useState("");
  if (pathname === "/") return null;
  return (
    <form role="search" onSubmit={(e) => { e.preventDefault(); router.push(q ? `/?q=${encodeURIComponent(q)}` : "/"); }}>
      <label htmlFor="header-q" className="sr-only">Search the library</label>
      <input id="header-q" type="search" value={q} onChange={(e) => setQ(e.target.value)} placeholder="Search blocks"
        className="w-36 rounded border border-rule bg-paper px-2 py-1 text-sm sm:w-48" />
    </form>
  );
}
