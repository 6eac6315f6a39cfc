"use client";
import { useState } from "react";

/** A netlist or script with copy and download; the text is shown as written. */
export function CodePanel({ title, text, fileName, type = "text/plain" }: { title: string; text: string; fileName: string; type?: string }) {
  const [copied, setCopied] = useState(false);
  const copy = async () => {
    await navigator.clipboard.writeText(text);
    setCopied(true);
    setTimeout(() => setCopied(false), 1500);
  };
  const href = `data:${type};charset=utf-8,${encodeURIComponent(text)}`;
  return (
    <section className="rounded border border-rule bg-panel" aria-label={title}>
      <header className="flex flex-wrap items-center justify-between gap-2 border-b border-rule px-3 py-1.5">
        <h3 className="text-sm font-semibold">{title}</h3>
        <div className="flex gap-2 text-xs">
          <button type="button" onClick={copy} className="rounded border border-rule px-2 py-0.5 hover:border-copper">{copied ? "Copied" : "Copy"}</button>
          <a href={href} download={fileName} className="rounded border border-rule px-2 py-0.5 hover:border-copper">Download</a>
          <span aria-live="polite" className="sr-only">{copied ? "copied" : ""}</span>
        </div>
      </header>
      <pre className="max-h-96 overflow-auto px-3 py-2 font-mono text-xs leading-relaxed"><code>{text || "—"}</code></pre>
    </section>
  );
}
