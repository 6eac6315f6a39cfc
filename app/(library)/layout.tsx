import type { ReactNode } from "react";
import { Providers } from "@/app/providers";
import { SiteHeader } from "@/components/site-header";
import "./library.css";

export default function LibraryLayout({ children }: { children: ReactNode }) {
  return (
    <Providers>
      <a href="#main" className="sr-only focus:not-sr-only focus:absolute focus:left-2 focus:top-2 focus:z-50 focus:bg-panel focus:px-3 focus:py-1">Skip to content</a>
      <SiteHeader />
      <main id="main" className="mx-auto w-full max-w-7xl px-4 pb-16 pt-6 sm:px-6">{children}</main>
    </Providers>
  );
}
