"use client";
import Link from "next/link";
import { keepPreviousData, useQuery } from "@tanstack/react-query";
import { useActionState, useRef, useState } from "react";
import { checkDraftAction, saveEditAction } from "@/lib/actions/edit";
import { useDebounced } from "@/components/library/use-debounced";
import { DraftSimulation } from "@/components/retune/draft-simulation";

/** The block file in a monospace editor; the engine's errors sit beside the lines they name. */
export function BlockEditor({ slug, baseVersion, initialText, readOnly }: { slug: string; baseVersion: number; initialText: string; readOnly?: string }) {
  const [text, setText] = useState(initialText);
  // Controlled, so a refused save (React resets uncontrolled fields after an action) keeps the message too.
  const [message, setMessage] = useState("");
  const [state, action, pending] = useActionState(saveEditAction, {});
  const gutter = useRef<HTMLDivElement>(null);
  const draft = useDebounced(text, 400);
  const check = useQuery({ queryKey: ["draft-check", slug, draft], queryFn: () => checkDraftAction(draft, slug), placeholderData: keepPreviousData });
  // The text a save was refused for: its errors stay at the field until the text changes.
  const [sent, setSent] = useState<string | null>(null);
  // One list at the field: the live reading of the draft, and a refused save's errors when the draft reads the same
  // (the server and the live check run the same parser, so an error is listed once).
  const errors = unique([...(check.data?.errors ?? []), ...(sent === text ? state.lines ?? [] : [])]);
  const byLine = new Map<number, string[]>();
  for (const e of errors) if (e.line) byLine.set(e.line, [...(byLine.get(e.line) ?? []), e.message]);
  const lines = text.split("\n").length;

  return (
    <form action={action} onSubmit={() => setSent(text)} className="space-y-3" aria-describedby="editor-status">
      <input type="hidden" name="slug" value={slug} />
      <input type="hidden" name="baseVersion" value={baseVersion} />
      <label htmlFor="block-text" className="text-sm font-medium">Block file</label>
      <div className="flex max-h-[70vh] overflow-hidden rounded border border-rule bg-panel">
        <div ref={gutter} aria-hidden className="select-none overflow-hidden border-r border-rule bg-paper py-2 text-right font-mono text-xs leading-5 text-graphite">
          {Array.from({ length: lines }, (_, i) => (
            <div key={i} className={`px-2 ${byLine.has(i + 1) ? "bg-brick/15 font-semibold text-brick" : ""}`} title={byLine.get(i + 1)?.join("; ")}>{i + 1}</div>
          ))}
        </div>
        <textarea id="block-text" name="text" value={text} readOnly={Boolean(readOnly)} onChange={(e) => setText(e.target.value)} spellCheck={false} wrap="off"
          onScroll={(e) => { if (gutter.current) gutter.current.scrollTop = e.currentTarget.scrollTop; }}
          rows={Math.min(40, Math.max(16, lines))} aria-invalid={errors.length > 0} aria-describedby="editor-errors"
          className="min-w-0 flex-1 resize-none overflow-auto bg-panel px-3 py-2 font-mono text-xs leading-5 outline-none" />
      </div>
      <div id="editor-errors" aria-live="polite" className="text-sm">
        {errors.length ? (
          <ul className="space-y-0.5 text-brick" data-testid="editor-errors">
            {errors.map((e, i) => <li key={i}><span className="font-mono">{e.line ? `Line ${e.line}` : "File"}</span>: {e.message}</li>)}
          </ul>
        ) : check.data ? (
          <p className="text-verdigris">The engine reads the file{check.data.failing.length ? `; ${check.data.failing.length} expression check(s) fail: ${check.data.failing.join(", ")}` : ""}.</p>
        ) : <p className="text-graphite">Reading…</p>}
      </div>
      {readOnly ? null : (
        <div className="rounded border border-rule bg-panel px-3 pb-3">
          <DraftSimulation slug={slug} draft={{ text: draft }} disabled={errors.length ? "Fix the errors above first." : undefined} />
        </div>
      )}
      {readOnly ? (
        <p className="rounded border border-rule bg-panel px-3 py-2 text-sm" data-testid="editor-read-only">
          {readOnly} <Link href={`/blocks/${slug}`} className="text-copper-dark underline">Back to the block</Link>
        </p>
      ) : (
        <>
          <label htmlFor="edit-message" className="block text-sm">Message
            <input id="edit-message" name="message" value={message} onChange={(e) => setMessage(e.target.value)} className="mt-0.5 w-full rounded border border-rule bg-panel px-2 py-1 text-sm" placeholder="What changed and why" />
          </label>
          <div className="flex flex-wrap items-center gap-3">
            <button type="submit" disabled={pending || text === initialText} className="rounded bg-copper px-4 py-1.5 font-medium text-white hover:bg-copper-dark disabled:opacity-50">
              {pending ? "Saving…" : `Save as v${baseVersion + 1}`}
            </button>
            <Link href={`/blocks/${slug}`} className="text-sm text-graphite underline">Cancel</Link>
          </div>
        </>
      )}
      <div id="editor-status" aria-live="polite" className="text-sm">
        {state.message ? <p role={state.ok === false ? "alert" : undefined} className={state.ok === false ? "text-brick" : "text-verdigris"}>{state.message}</p> : null}
        {state.head ? (
          <p className="mt-1">
            <Link className="text-copper-dark underline" href={`/blocks/${slug}/versions/${state.head}`}>Read v{state.head}</Link> ·{" "}
            <Link className="text-copper-dark underline" href={`/blocks/${slug}/compare?a=${baseVersion}&b=${state.head}`}>compare v{baseVersion} with v{state.head}</Link>
          </p>
        ) : null}
        {state.errors?.text ? <p className="text-brick">{state.errors.text[0]}</p> : null}
      </div>
    </form>
  );
}

/** Each error once, in order. */
function unique(errors: { message: string; line?: number }[]): { message: string; line?: number }[] {
  const seen = new Set<string>();
  return errors.filter((e) => {
    const key = `${e.line ?? ""}:${e.message}`;
    if (seen.has(key)) return false;
    seen.add(key);
    return true;
  });
}
