"use client";
import { useActionState, useState } from "react";
import { createTokenAction, revokeTokenAction } from "@/lib/actions/tokens";

const input = "mt-1 w-full rounded border border-rule bg-panel px-3 py-1.5 text-sm focus:border-copper";

export function CreateTokenForm({ teams }: { teams: { slug: string; role: string }[] }) {
  const [state, action, pending] = useActionState(createTokenAction, {});
  const [copied, setCopied] = useState(false);
  const token = typeof state.data?.token === "string" ? state.data.token : null;
  return (
    <form action={action} className="space-y-3">
      <div className="grid gap-3 sm:grid-cols-2">
        <label className="block text-sm font-medium">
          Name
          <input name="name" required maxLength={100} placeholder="bench-rig CI" className={input} />
        </label>
        <label className="block text-sm font-medium">
          Team
          <select name="teamSlug" className={input} defaultValue={teams[0]?.slug}>
            {teams.map((t) => <option key={t.slug} value={t.slug}>{t.slug} (you are {t.role})</option>)}
          </select>
        </label>
        <fieldset className="text-sm">
          <legend className="font-medium">Scope</legend>
          <label className="mr-4"><input type="radio" name="scope" value="read" defaultChecked /> read</label>
          <label><input type="radio" name="scope" value="write" /> write</label>
          <p className="text-xs text-graphite">A token never does more than your role in its team allows.</p>
        </fieldset>
        <label className="block text-sm font-medium">
          Expires
          <select name="expiresInDays" className={input} defaultValue="90">
            <option value="7">in 7 days</option>
            <option value="30">in 30 days</option>
            <option value="90">in 90 days</option>
            <option value="365">in a year</option>
            <option value="0">never</option>
          </select>
        </label>
      </div>
      <button type="submit" disabled={pending}
        className="rounded bg-copper px-3 py-1.5 text-sm font-medium text-white hover:bg-copper-dark disabled:opacity-60">Create token</button>
      <p aria-live="polite" className={`text-sm ${state.ok === false ? "text-brick" : "text-verdigris"}`}>{state.message}</p>
      {token ? (
        <div className="rounded border border-verdigris bg-paper p-3" data-testid="new-token">
          <code className="block break-all font-mono text-sm">{token}</code>
          <button type="button" className="mt-2 text-sm text-copper-dark underline"
            onClick={() => void navigator.clipboard?.writeText(token).then(() => setCopied(true))}>{copied ? "Copied" : "Copy"}</button>
          <p className="mt-1 text-xs text-graphite">Use it as <code className="font-mono">Authorization: Bearer …</code>.</p>
        </div>
      ) : null}
    </form>
  );
}

export function RevokeButton({ id, name }: { id: number; name: string }) {
  const [state, action, pending] = useActionState(revokeTokenAction, {});
  return (
    <form action={action} onSubmit={(e) => { if (!confirm(`Revoke “${name}”? Scripts using it stop working at once.`)) e.preventDefault(); }}>
      <input type="hidden" name="id" value={id} />
      <button type="submit" disabled={pending} className="text-sm text-brick hover:underline disabled:opacity-60">Revoke</button>
      {state.ok === false ? <span className="ml-2 text-xs text-brick">{state.message}</span> : null}
    </form>
  );
}
