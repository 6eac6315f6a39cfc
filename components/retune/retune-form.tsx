"use client";
import { useActionState, useMemo, useState } from "react";
import { saveRetuneAction } from "@/lib/actions/retune";
import { useDebounced } from "@/components/library/use-debounced";
import type { ParamRow } from "@/components/param-table";
import { useEvaluateBlock } from "@/lib/queries/evaluate-block";
import { LivePreview } from "./live-preview";
import { ParamInput } from "./param-input";
import { PreviewStrip } from "./preview-strip";
import { RetuneAssistant } from "./retune-assistant";

/** preview: "exact" when the head's file with this version's values is this version; else the head the server computes from. */
export function RetuneForm({ slug, version, params, baseValues, head, preview: previewBase, quantities, canEdit, whyNotVersion, teams, defaultTeam }: {
  slug: string; version: number; params: ParamRow[]; baseValues: Record<string, string>; head: { version: number; values: Record<string, string> }; preview: "exact" | { headVersion: number };
  quantities: string[]; canEdit: boolean; whyNotVersion?: string; teams: string[]; defaultTeam?: string;
}) {
  const [values, setValues] = useState<Record<string, string>>(() => Object.fromEntries(params.map((p) => [p.name, p.value])));
  const [saveAs, setSaveAs] = useState<"fork" | "version">("fork");
  // Controlled fields: React resets uncontrolled ones after an action, and a refused save should keep what was typed.
  const [meta, setMeta] = useState({ newSlug: "", title: "", message: "", team: defaultTeam ?? "" });
  const setMetaField = (k: keyof typeof meta) => (e: { target: { value: string } }) => setMeta((m) => ({ ...m, [k]: e.target.value }));
  const [state, action, pending] = useActionState(saveRetuneAction, {});
  const changed = useMemo(() => Object.fromEntries(Object.entries(values).filter(([k, v]) => params.find((p) => p.name === k)?.value !== v)), [values, params]);
  // The server evaluates the head's file; sending this version's values too makes an older base come out as itself.
  const draftValues = useMemo(() => ({ ...baseValues, ...Object.fromEntries(Object.entries(changed).filter(([k]) => k in baseValues)) }), [baseValues, changed]);
  const draft = useDebounced(draftValues, 250);
  const preview = useEvaluateBlock(slug, draft);
  const previewQuantities = Object.keys(preview.data?.quantities ?? {});
  const set = (name: string, v: string) => setValues((s) => ({ ...s, [name]: v }));
  const field = "w-full rounded border border-rule bg-panel px-2 py-1 text-sm";

  return (
    <div className="grid gap-6 lg:grid-cols-[minmax(0,1fr)_minmax(0,26rem)]">
      <form action={action} className="space-y-5" aria-describedby="save-message">
        <input type="hidden" name="source" value={slug} />
        <input type="hidden" name="fromVersion" value={version} />
        <input type="hidden" name="params" value={JSON.stringify(changed)} />
        <fieldset className="rounded border border-rule bg-panel p-3">
          <legend className="px-1 text-sm font-semibold">Parameters</legend>
          <div className="space-y-2">
            {params.map((p) => <ParamInput key={p.name} param={p} value={values[p.name] ?? ""} onChange={(v) => set(p.name, v)}
              error={state.errors?.[`param.${p.name}`]?.[0]} />)}
          </div>
          {state.errors?.params ? <p className="mt-1 text-sm text-brick">{state.errors.params[0]}</p> : null}
          <PreviewStrip query={preview} />
        </fieldset>

        <fieldset className="space-y-2 rounded border border-rule bg-panel p-3">
          <legend className="px-1 text-sm font-semibold">Save as</legend>
          <label className="flex items-center gap-2 text-sm">
            <input type="radio" name="saveAs" value="fork" checked={saveAs === "fork"} onChange={() => setSaveAs("fork")} className="accent-copper" />
            a fork: a new block that records where it came from
          </label>
          <label className={`flex items-center gap-2 text-sm ${canEdit ? "" : "opacity-50"}`}>
            <input type="radio" name="saveAs" value="version" checked={saveAs === "version"} disabled={!canEdit} onChange={() => setSaveAs("version")} className="accent-copper" />
            the next version of this block{canEdit ? "" : ` (${whyNotVersion ?? "you may not edit it"})`}
          </label>
          {saveAs === "fork" ? (
            <div className="grid gap-2 sm:grid-cols-3">
              <label className="text-sm" htmlFor="fork-slug">Slug of the fork (optional)
                <input id="fork-slug" name="newSlug" value={meta.newSlug} onChange={setMetaField("newSlug")} className={`${field} font-mono`} placeholder={`${slug}-fork`} aria-invalid={Boolean(state.errors?.newSlug)} />
                {state.errors?.newSlug ? <span className="text-xs text-brick">{state.errors.newSlug[0]}</span> : null}
              </label>
              <label className="text-sm" htmlFor="fork-title">Title (optional)
                <input id="fork-title" name="title" value={meta.title} onChange={setMetaField("title")} className={field} aria-invalid={Boolean(state.errors?.title)} />
                {state.errors?.title ? <span className="text-xs text-brick">{state.errors.title[0]}</span> : null}
              </label>
              <label className="text-sm" htmlFor="fork-team">Team
                <select id="fork-team" name="team" value={meta.team} onChange={setMetaField("team")} disabled={teams.length === 0} className={field}>
                  {teams.map((t) => <option key={t}>{t}</option>)}
                </select>
              </label>
            </div>
          ) : null}
          <label className="block text-sm" htmlFor="retune-message">Message
            <input id="retune-message" name="message" value={meta.message} onChange={setMetaField("message")} className={field} placeholder="What you changed and why" aria-invalid={Boolean(state.errors?.message)} />
            {state.errors?.message ? <span className="text-xs text-brick">{state.errors.message[0]}</span> : null}
          </label>
        </fieldset>

        <div className="flex flex-wrap items-center gap-3">
          <button type="submit" disabled={pending || (saveAs === "fork" && teams.length === 0)} className="rounded bg-copper px-4 py-1.5 font-medium text-white hover:bg-copper-dark disabled:opacity-60">
            {pending ? "Saving…" : saveAs === "fork" ? "Save the fork" : "Save the version"}
          </button>
          {saveAs === "fork" && teams.length === 0 ? (
            <span className="text-sm text-brick" data-testid="fork-no-team">You are a viewer in every team, so you can try values here but not save a fork.</span>
          ) : null}
          <span className="text-xs text-graphite">{Object.keys(changed).length} value{Object.keys(changed).length === 1 ? "" : "s"} changed</span>
        </div>
        <div id="save-message" aria-live="polite" className="text-sm">
          {state.message ? <p className={state.ok === false ? "text-brick" : "text-verdigris"}>{state.message}</p> : null}
          {state.lines?.length ? <ul className="list-disc pl-5 text-brick">{state.lines.map((l, i) => <li key={i}>{l.line ? `line ${l.line}: ` : ""}{l.message}</li>)}</ul> : null}
        </div>
      </form>
      <div className="space-y-4">
        {previewBase !== "exact" ? (
          <p className="rounded border border-ochre bg-panel p-3 text-sm" data-testid="preview-base-note">
            v{version} differs from the head (v{previewBase.headVersion}) in more than its values. The live preview
            computes v{previewBase.headVersion}&apos;s netlist and expressions with v{version}&apos;s values; the saved fork is
            built from v{version} and checked in full.
          </p>
        ) : null}
        <div id="retune" className="scroll-mt-4">
          <RetuneAssistant slug={slug} params={params.map((p) => p.name)} quantities={previewQuantities.length ? previewQuantities : quantities} onUse={set}
            values={values} head={head} />
        </div>
        <LivePreview query={preview} slug={slug} values={draft} />
      </div>
    </div>
  );
}
