"use client";
import { useActionState, useId, useState } from "react";
import { addAttachmentAction } from "@/lib/actions/attachments";
import { formatBytes } from "./format-bytes";

const LIMIT = 1024 * 1024;

export function AttachmentUpload({ slug }: { slug: string }) {
  const id = useId();
  const [state, action, pending] = useActionState(addAttachmentAction, {});
  const [local, setLocal] = useState<string | null>(null);
  // Said before the upload: a file over the limit never leaves the browser.
  const onFile = (f: File | undefined) => {
    if (!f) return setLocal(null);
    if (f.type !== "image/png" && f.type !== "image/svg+xml") return setLocal(`${f.name} is not a PNG or SVG image.`);
    setLocal(f.size > LIMIT ? `${f.name} is ${formatBytes(f.size)}; the limit is 1 MiB.` : null);
  };
  const fileError = local ?? state.errors?.file?.[0];
  return (
    <form action={action} className="mt-3 space-y-2 border-t border-rule pt-3" data-testid="attachment-form">
      <input type="hidden" name="slug" value={slug} />
      <label className="block text-sm" htmlFor={`${id}-file`}>Schematic image (PNG or SVG, at most 1 MiB)
        <input id={`${id}-file`} name="file" type="file" accept="image/png,image/svg+xml,.png,.svg" required
          onChange={(e) => onFile(e.target.files?.[0])} aria-invalid={Boolean(fileError)} aria-describedby={`${id}-msg`}
          className="mt-1 block w-full text-sm file:mr-3 file:rounded file:border file:border-rule file:bg-paper file:px-2 file:py-1" />
      </label>
      <label className="block text-sm" htmlFor={`${id}-name`}>Name in the note (optional)
        <input id={`${id}-name`} name="name" placeholder="schematic.svg" aria-invalid={Boolean(state.errors?.name)}
          className="mt-1 w-full rounded border border-rule bg-paper px-2 py-1 font-mono text-sm" />
      </label>
      <button type="submit" disabled={pending || Boolean(local)}
        className="rounded border border-copper px-3 py-1 text-sm text-copper-dark hover:bg-copper-pale disabled:opacity-50">
        {pending ? "Attaching…" : "Attach"}
      </button>
      <div id={`${id}-msg`} aria-live="polite" className="text-sm" data-testid="attachment-message">
        {fileError ? <p className="text-brick">{fileError}</p> : null}
        {state.errors?.name ? <p className="text-brick">{state.errors.name[0]}</p> : null}
        {state.message ? <p className={state.ok ? "text-verdigris" : "text-brick"}>{state.message}</p> : null}
      </div>
    </form>
  );
}
