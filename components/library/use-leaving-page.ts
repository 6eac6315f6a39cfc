"use client";
import { useEffect, useRef } from "react";

/**
 * True from the moment the person follows a link to another page of the app until they use this page again.
 *
 * Next's router takes any history.replaceState as a new current location and drops a navigation still waiting for
 * its page (next/dist/client/components/app-router-instance.js: a restore marks the pending navigation discarded).
 * A block page has no loading boundary (it must be able to answer 404), so its navigation waits for the server; a
 * search box whose debounced address update lands in that wait would cancel the click. Reading this ref first,
 * the box leaves the address alone once its page is being left.
 */
export function useLeavingPage() {
  const leaving = useRef(false);
  useEffect(() => {
    const onClick = (e: MouseEvent) => {
      // A click the browser opens elsewhere (new tab or window, download) leaves this page where it is.
      if (e.button !== 0 || e.metaKey || e.ctrlKey || e.shiftKey || e.altKey) return;
      const a = e.target instanceof Element ? e.target.closest<HTMLAnchorElement>("a[href]") : null;
      if (!a || (a.target && a.target !== "_self") || a.hasAttribute("download")) return;
      const to = new URL(a.href, window.location.href);
      if (to.origin === window.location.origin && to.pathname !== window.location.pathname) leaving.current = true;
    };
    // Capture: seen before the link's own handler starts the navigation.
    window.addEventListener("click", onClick, true);
    return () => window.removeEventListener("click", onClick, true);
  }, []);
  return leaving;
}
