import type { Metadata } from "next";
import { when } from "@/components/eng";
import { EmptyState } from "@/components/empty-state";
import { can } from "@/lib/auth/permissions";
import { requireUser } from "@/lib/auth/session";
import { pageContext } from "@/lib/next-context";
import { listTokens, type TokenRow } from "@/lib/tokens/manage";
import { tokenRules } from "@/lib/tokens/rules";
import { SettingsNav } from "../settings-nav";
import { CreateTokenForm, RevokeButton } from "./token-forms";

export const metadata: Metadata = { title: "API tokens" };
export const dynamic = "force-dynamic";

function state(t: TokenRow, now: number): string {
  if (t.revokedAt) return `revoked ${when(t.revokedAt.toISOString())}`;
  if (t.expiresAt && t.expiresAt.getTime() <= now) return "expired";
  return "active";
}

export default async function TokensPage() {
  const caller = await requireUser("/settings/tokens");
  const tokens = await listTokens(await pageContext());
  const now = Date.now();
  const others = tokens.some((t) => !t.mine);
  const rules = tokenRules();
  // The teams the server lets this person make a token for (lib/tokens/manage.ts asks the same question).
  const teams = caller.memberships.filter((m) => can(caller, "token.create", { kind: "team", teamId: m.teamId }));
  return (
    <div className="max-w-5xl space-y-6">
      <h1 className="font-serif text-2xl font-semibold">Settings</h1>
      <SettingsNav at="tokens" />
      <section aria-labelledby="new-h" className="rounded border border-rule bg-panel p-4">
        <h2 id="new-h" className="mb-1 font-serif text-lg font-semibold">New API token</h2>
        <p className="mb-3 text-sm text-graphite" data-testid="token-rules">
          For scripts and CI that fetch blocks through <code className="font-mono">/api/v1</code>. {rules.create} {rules.reach} {rules.manage}
        </p>
        {teams.length ? (
          <CreateTokenForm teams={teams.map((m) => ({ slug: m.teamSlug, role: m.role }))} />
        ) : (
          <p className="text-sm text-graphite">
            {caller.memberships.length ? "Your role in your teams does not let you make tokens." : "You are not in a team yet, so there is nothing a token could reach."}
          </p>
        )}
      </section>
      <section aria-labelledby="list-h">
        <h2 id="list-h" className="mb-2 font-serif text-lg font-semibold">{others ? "Tokens (yours, and your teams' as admin)" : "Your tokens"}</h2>
        {tokens.length === 0 ? (
          <EmptyState title="No tokens yet." />
        ) : (
          <div className="overflow-x-auto rounded border border-rule bg-panel">
            <table className="w-full text-left text-sm">
              <thead className="border-b border-rule text-xs uppercase tracking-wide text-graphite">
                <tr><th className="px-3 py-2">Name</th><th className="px-3 py-2">Token</th><th className="px-3 py-2">Team</th><th className="px-3 py-2">Scope</th>
                  {others ? <th className="px-3 py-2">Owner</th> : null}
                  <th className="px-3 py-2">Created</th><th className="px-3 py-2">Expires</th><th className="px-3 py-2">Last used</th><th className="px-3 py-2">State</th><th className="px-3 py-2"><span className="sr-only">Actions</span></th></tr>
              </thead>
              <tbody>
                {tokens.map((t) => {
                  const s = state(t, now);
                  return (
                    <tr key={t.id} className={`border-b border-rule last:border-0 ${s === "active" ? "" : "text-graphite"}`}>
                      <td className="px-3 py-2">{t.name}</td>
                      <td className="px-3 py-2 font-mono">{t.prefix}…</td>
                      <td className="px-3 py-2 font-mono">{t.team}</td>
                      <td className="px-3 py-2">{t.scope}</td>
                      {others ? <td className="px-3 py-2">{t.mine ? "you" : t.owner}</td> : null}
                      <td className="px-3 py-2 whitespace-nowrap">{when(t.createdAt.toISOString())}</td>
                      <td className="px-3 py-2 whitespace-nowrap">{t.expiresAt ? when(t.expiresAt.toISOString()) : "never"}</td>
                      <td className="px-3 py-2 whitespace-nowrap">{t.lastUsedAt ? when(t.lastUsedAt.toISOString()) : "never"}</td>
                      <td className="px-3 py-2">{s}</td>
                      <td className="px-3 py-2">{s === "active" ? <RevokeButton id={t.id} name={t.name} /> : null}</td>
                    </tr>
                  );
                })}
              </tbody>
            </table>
          </div>
        )}
      </section>
    </div>
  );
}
