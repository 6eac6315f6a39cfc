import type { Metadata } from "next";
import Link from "next/link";
import { when } from "@/components/eng";
import { EmptyState } from "@/components/empty-state";
import { pendingInvitations } from "@/lib/auth/invitations";
import { requireUser } from "@/lib/auth/session";
import { adminTeams, listMembers } from "@/lib/auth/teams";
import { pageContext } from "@/lib/next-context";
import { InviteForm, RemoveForm, RoleForm, WithdrawForm } from "./team-forms";

export const metadata: Metadata = { title: "Team" };
export const dynamic = "force-dynamic";

export default async function TeamPage({ searchParams }: { searchParams: Promise<{ team?: string }> }) {
  const caller = await requireUser("/team");
  const mine = adminTeams(caller);
  if (mine.length === 0) {
    return (
      <div className="max-w-3xl space-y-4">
        <h1 className="font-serif text-2xl font-semibold">Team</h1>
        <EmptyState title="Members, roles and invitations are managed by each team's admins.">
          Your teams: {caller.memberships.map((m) => `${m.teamSlug} (${m.role})`).join(", ") || "none yet"}.
        </EmptyState>
      </div>
    );
  }
  const { team: wanted } = await searchParams;
  const slug = mine.find((m) => m.teamSlug === wanted)?.teamSlug ?? mine[0].teamSlug;
  const ctx = await pageContext();
  const members = await listMembers(ctx, { teamSlug: slug });
  const invitations = await pendingInvitations(ctx, { teamSlug: slug });
  const admins = members.filter((m) => m.role === "admin").length;
  return (
    <div className="max-w-5xl space-y-6">
      <div className="flex flex-wrap items-baseline gap-4">
        <h1 className="font-serif text-2xl font-semibold">Team <span className="font-mono text-xl">{slug}</span></h1>
        {mine.length > 1 ? (
          <nav aria-label="Teams you administer" className="flex gap-3 text-sm">
            {mine.map((m) => (
              <Link key={m.teamId} href={`/team?team=${m.teamSlug}`} aria-current={m.teamSlug === slug ? "page" : undefined}
                className={m.teamSlug === slug ? "font-medium text-ink" : "text-copper-dark hover:underline"}>{m.teamSlug}</Link>
            ))}
          </nav>
        ) : null}
      </div>
      <p className="max-w-prose text-sm text-graphite">
        viewer reads and fetches · author creates, forks and edits own blocks · maintainer edits any block, approves and archives ·
        admin manages members, roles, invitations and tokens. A team always keeps at least one admin.
      </p>
      <section aria-labelledby="members-h">
        <h2 id="members-h" className="mb-2 font-serif text-lg font-semibold">Members ({members.length})</h2>
        <div className="overflow-x-auto rounded border border-rule bg-panel">
          <table className="w-full text-left text-sm">
            <thead className="border-b border-rule text-xs uppercase tracking-wide text-graphite">
              <tr><th className="px-3 py-2">Name</th><th className="px-3 py-2">E-mail</th><th className="px-3 py-2">Role</th><th className="px-3 py-2">Since</th><th className="px-3 py-2"><span className="sr-only">Remove</span></th></tr>
            </thead>
            <tbody>
              {members.map((m) => {
                const lastAdmin = m.role === "admin" && admins === 1;
                return (
                  <tr key={m.userId} className="border-b border-rule last:border-0">
                    <td className="px-3 py-2">{m.name}{m.userId === caller.user.id ? <span className="text-graphite"> (you)</span> : null}</td>
                    <td className="px-3 py-2 font-mono">{m.email}</td>
                    <td className="px-3 py-2">
                      {lastAdmin ? <span title="The last admin cannot be demoted">admin <span className="text-xs text-graphite">(last admin)</span></span>
                        : <RoleForm teamSlug={slug} userId={m.userId} role={m.role} name={m.name} />}
                    </td>
                    <td className="px-3 py-2 whitespace-nowrap">{when(m.since.toISOString())}</td>
                    <td className="px-3 py-2">{lastAdmin ? null : <RemoveForm teamSlug={slug} userId={m.userId} name={m.name} />}</td>
                  </tr>
                );
              })}
            </tbody>
          </table>
        </div>
      </section>
      <section aria-labelledby="invite-h" className="rounded border border-rule bg-panel p-4">
        <h2 id="invite-h" className="mb-1 font-serif text-lg font-semibold">Invite someone</h2>
        <p className="mb-3 text-sm text-graphite">They get a mail with a link that works once, for seven days. Someone who already has an account joins with one click.</p>
        <InviteForm teamSlug={slug} />
        {invitations.length ? (
          <table className="mt-4 w-full text-left text-sm">
            <caption className="text-left text-xs uppercase tracking-wide text-graphite">Waiting for an answer</caption>
            <tbody>
              {invitations.map((i) => (
                <tr key={i.id} className="border-b border-rule last:border-0">
                  <td className="py-1 font-mono">{i.email}</td><td className="py-1">{i.role}</td>
                  <td className="py-1 text-graphite">by {i.invitedBy}, expires {when(i.expiresAt.toISOString())}</td>
                  <td className="py-1"><WithdrawForm teamSlug={slug} id={i.id} /></td>
                </tr>
              ))}
            </tbody>
          </table>
        ) : null}
      </section>
    </div>
  );
}
