"use client";
import { useActionState } from "react";
import { uploadModelAction } from "@/lib/actions/models";

/** Upload a new version; before sending, the form names the blocks that will be verified again with it. */
export function ModelUploadForm({ team, name, reverify }: { team: string; name?: string; reverify: string[] }) {
  const [state, action, pending] = useActionState(uploadModelAction, {});
  return (
    <form action={action} aria-label={name ? "Upload a new version" : `Add a model file to ${team}`} className="space-y-2 rounded border border-rule bg-panel p-3 text-sm">
      <h2 className="font-semibold">{name ? "Upload a new version" : `Add a model file to ${team}`}</h2>
      <input type="hidden" name="team" value={team} />
      {name ? <input type="hidden" name="name" value={name} /> : (
        <label className="block">Name <input name="name" required placeholder="opa-part.lib" className="block w-full rounded border border-rule px-1 font-mono" /></label>
      )}
      {state.errors?.name ? <p className="text-brick">{state.errors.name.join("; ")}</p> : null}
      <label className="block">File <input name="file" type="file" accept=".lib,.mod,.sub,.cir,text/plain" className="block w-full" /></label>
      <label className="block">or its text <textarea name="text" rows={5} className="block w-full rounded border border-rule font-mono text-xs" /></label>
      <label className="block">What changed <input name="message" className="block w-full rounded border border-rule px-1" /></label>
      {name ? (
        <p data-testid="will-reverify" className="text-graphite">
          {reverify.length ? `Uploading verifies again: ${reverify.join(", ")}.` : "No block of the team includes this file yet."}
        </p>
      ) : null}
      <button type="submit" disabled={pending} className="rounded border border-copper px-3 py-1 hover:bg-copper/10">{pending ? "Uploading…" : "Upload"}</button>
      <div aria-live="polite">
        {state.message ? <p className={state.ok ? "text-verdigris" : "text-brick"}>{state.message}</p> : null}
        {state.lines?.length ? <ul>{state.lines.map((l, i) => <li key={i} className="text-brick">{l.line ? `line ${l.line}: ` : ""}{l.message}</li>)}</ul> : null}
      </div>
    </form>
  );
}
