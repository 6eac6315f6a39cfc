import type { Metadata } from "next";
import { ownProfile } from "@/lib/auth/profile";
import { requireUser } from "@/lib/auth/session";
import { pageContext } from "@/lib/next-context";
import { NameForm, PasswordForm } from "./profile-forms";
import { SettingsNav } from "./settings-nav";

export const metadata: Metadata = { title: "Settings" };
export const dynamic = "force-dynamic";

export default async function SettingsPage() {
  const caller = await requireUser("/settings");
  const user = await ownProfile(await pageContext());
  return (
    <div className="max-w-3xl space-y-6">
      <h1 className="font-serif text-2xl font-semibold">Settings</h1>
      <SettingsNav at="profile" />
      <div className="grid gap-6 md:grid-cols-2">
        <section aria-labelledby="profile-h" className="rounded border border-rule bg-panel p-4">
          <h2 id="profile-h" className="mb-3 font-serif text-lg font-semibold">Profile</h2>
          <p className="mb-3 text-sm text-graphite">Signed in as <span className="font-mono">{user.email}</span>.</p>
          <NameForm name={user.name} />
        </section>
        <section aria-labelledby="pw-h" className="rounded border border-rule bg-panel p-4">
          <h2 id="pw-h" className="mb-3 font-serif text-lg font-semibold">Password</h2>
          <PasswordForm hasPassword={user.hasPassword} />
        </section>
      </div>
      <section aria-labelledby="teams-h" className="rounded border border-rule bg-panel p-4">
        <h2 id="teams-h" className="mb-2 font-serif text-lg font-semibold">Your teams</h2>
        <ul className="text-sm">
          {caller.memberships.map((m) => (
            <li key={m.teamId} className="flex justify-between border-b border-rule py-1 last:border-0">
              <span className="font-mono">{m.teamSlug}</span><span className="text-graphite">{m.role}</span>
            </li>
          ))}
        </ul>
      </section>
    </div>
  );
}
