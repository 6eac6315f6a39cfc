"use client";
import { useActionState, useEffect, useState } from "react";
import { convertNetlistAction, createImportAction } from "@/lib/actions/import";
import { ImportParams, withParamLine, type ImportedParam } from "./import-params";

const field = "w-full rounded border border-rule bg-panel px-2 py-1 text-sm";

/** Two steps: read the uploaded file into a block file (showing what was dropped), then create it with its images. */
export function ImportForm({ teams }: { teams: string[] }) {
  const [read, readAction, reading] = useActionState(convertNetlistAction, {});
  const [made, createAction, creating] = useActionState(createImportAction, {});
  const [text, setText] = useState("");
  const [params, setParams] = useState<ImportedParam[]>([]);
  useEffect(() => {
    if (read.data?.blockText) setText(String(read.data.blockText));
    setParams((read.data?.params as ImportedParam[] | undefined) ?? []);
  }, [read.data]);
  const editParam = (p: ImportedParam) => {
    setParams((all) => all.map((q) => (q.name === p.name ? p : q)));
    setText((t) => withParamLine(t, p));
  };
  const dropped = (read.data?.dropped as string[] | undefined) ?? [];

  return (
    <div className="grid items-start gap-6 lg:grid-cols-2">
      <form action={readAction} className="space-y-3 rounded border border-rule bg-panel p-4" aria-describedby="read-status">
        <h2 className="text-sm font-semibold">1 · Choose a file</h2>
        <label htmlFor="import-file" className="block text-sm">Block file or SPICE netlist
          <input id="import-file" name="file" type="file" accept=".md,.cir,.sp,.net,text/markdown,text/plain" required
            aria-invalid={Boolean(read.errors?.file)} className={`${field} mt-0.5`} />
        </label>
        {read.errors?.file ? <p className="text-sm text-brick" role="alert">{read.errors.file[0]}</p> : null}
        <button type="submit" disabled={reading} className="rounded bg-copper px-3 py-1 text-sm font-medium text-white hover:bg-copper-dark disabled:opacity-60">
          {reading ? "Reading…" : "Read the file"}
        </button>
        <div id="read-status" aria-live="polite" className="text-sm">
          {read.message ? <p className={read.ok === false ? "text-brick" : "text-verdigris"}>{read.message}</p> : null}
          {read.lines?.length ? <ul className="list-disc pl-5 text-brick">{read.lines.map((l, i) => <li key={i}>{l.line ? `line ${l.line}: ` : ""}{l.message}</li>)}</ul> : null}
          {dropped.length ? (
            <div className="mt-2" data-testid="dropped-lines">
              <p className="font-medium">Dropped lines ({dropped.length}) — a block states its analyses in the check script:</p>
              <pre className="mt-1 max-h-48 overflow-auto rounded bg-paper p-2 font-mono text-xs">{dropped.join("\n")}</pre>
            </div>
          ) : read.data && read.ok ? <p className="mt-1 text-graphite">No lines were dropped.</p> : null}
        </div>
      </form>

      <form action={createAction} className="space-y-3 rounded border border-rule bg-panel p-4" aria-describedby="create-status">
        <h2 className="text-sm font-semibold">2 · Check the block file and create it</h2>
        <ImportParams params={params} onChange={editParam} />
        <label htmlFor="import-text" className="block text-sm">Block file
          <textarea id="import-text" name="text" value={text} onChange={(e) => setText(e.target.value)} rows={18} spellCheck={false} wrap="off"
            aria-invalid={Boolean(made.lines?.length || made.errors?.text)} aria-describedby="import-text-errors"
            className={`${field} mt-0.5 font-mono text-xs leading-5`} placeholder="The file read in step 1 appears here; you may also paste one." />
        </label>
        <div id="import-text-errors" className="text-sm text-brick">
          {made.errors?.text ? <p>{made.errors.text[0]}</p> : null}
          {made.lines?.length ? <ul className="space-y-0.5" data-testid="create-errors">{made.lines.map((l, i) => <li key={i}><span className="font-mono">{l.line ? `Line ${l.line}` : "File"}</span>: {l.message}</li>)}</ul> : null}
        </div>
        <div className="grid gap-2 sm:grid-cols-2">
          <label htmlFor="import-team" className="text-sm">Team
            <select id="import-team" name="team" className={field}>{teams.map((t) => <option key={t}>{t}</option>)}</select>
          </label>
          <label htmlFor="import-visibility" className="text-sm">Visible to
            <select id="import-visibility" name="visibility" className={field}><option value="team">the team</option><option value="public">everyone</option></select>
          </label>
        </div>
        <label htmlFor="import-images" className="block text-sm">Schematic images (PNG or SVG, ≤ 1 MiB each, optional)
          <input id="import-images" name="images" type="file" multiple accept=".png,.svg,image/png,image/svg+xml" className={`${field} mt-0.5`} aria-invalid={Boolean(made.errors?.images)} />
        </label>
        {made.errors?.images ? <p className="text-sm text-brick" role="alert">{made.errors.images[0]}</p> : null}
        <button type="submit" disabled={creating || !text.trim()} className="rounded bg-copper px-3 py-1 text-sm font-medium text-white hover:bg-copper-dark disabled:opacity-50">
          {creating ? "Creating…" : "Create the block"}
        </button>
        <div id="create-status" aria-live="polite" className="text-sm">
          {made.message ? <p role={made.ok === false ? "alert" : undefined} className={made.ok === false ? "text-brick" : "text-verdigris"}>{made.message}</p> : null}
        </div>
      </form>
    </div>
  );
}
