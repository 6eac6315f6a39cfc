"use client";
import { useEffect } from "react";

/** The segment's error boundary: plain words, the digest for the server log, and a retry. */
export function ErrorPanel({ error, reset }: { error: Error & { digest?: string }; reset: () => void }) {
  useEffect(() => {
    console.warn("page error", error.digest ?? error.message);
  }, [error]);
  return (
    <div role="alert" className="mx-auto max-w-prose rounded border border-brick/40 bg-panel p-6">
      <h1 className="font-serif text-xl font-semibold">This page could not be shown</h1>
      <p className="mt-2 text-sm text-graphite">The server hit a problem while loading it. Nothing was changed.</p>
      {error.digest ? <p className="mt-1 font-mono text-xs text-graphite">reference {error.digest}</p> : null}
      <button type="button" onClick={reset} className="mt-4 rounded bg-copper px-3 py-1 text-sm font-medium text-white hover:bg-copper-dark">Try again</button>
    </div>
  );
}
