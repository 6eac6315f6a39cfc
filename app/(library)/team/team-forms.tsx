"use client";
import { useActionState } from "react";
import { changeRoleAction, inviteAction, removeMemberAction, withdrawAction } from "@/lib/actions/team";

// The role ladder of DESIGN.md (entities/membership.entity.ts); repeated here to keep the ORM out of the browser bundle.
const ROLES = ["viewer", "author", "maintainer", "admin"] as const;
const field = "rounded border border-rule bg-panel px-2 py-1 text-sm focus:border-copper";
const note = (ok?: boolean) => `text-xs ${ok === false ? "text-brick" : "text-verdigris"}`;

export function RoleForm({ teamSlug, userId, role, name }: { teamSlug: string; userId: number; role: string; name: string }) {
  const [state, action, pending] = useActionState(changeRoleAction, {});
  return (
    <form action={action} className="flex flex-wrap items-center gap-2">
      <input type="hidden" name="teamSlug" value={teamSlug} />
      <input type="hidden" name="userId" value={userId} />
      <label className="sr-only" htmlFor={`role-${userId}`}>Role of {name}</label>
      <select id={`role-${userId}`} name="role" defaultValue={role} className={field}>
        {ROLES.map((r) => <option key={r} value={r}>{r}</option>)}
      </select>
      <button type="submit" disabled={pending} className="text-sm text-copper-dark hover:underline disabled:opacity-60">Set</button>
      <span aria-live="polite" className={note(state.ok)}>{state.message}</span>
    </form>
  );
}

export function RemoveForm({ teamSlug, userId, name }: { teamSlug: string; userId: number; name: string }) {
  const [state, action, pending] = useActionState(removeMemberAction, {});
  return (
    <form action={action} onSubmit={(e) => { if (!confirm(`Remove ${name} from the team?`)) e.preventDefault(); }}>
      <input type="hidden" name="teamSlug" value={teamSlug} />
      <input type="hidden" name="userId" value={userId} />
      <button type="submit" disabled={pending} className="text-sm text-brick hover:underline disabled:opacity-60">Remove</button>
      {state.ok === false ? <span className="ml-2 text-xs text-brick" aria-live="polite">{state.message}</span> : null}
    </form>
  );
}

export function InviteForm({ teamSlug }: { teamSlug: string }) {
  const [state, action, pending] = useActionState(inviteAction, {});
  return (
    <form action={action} className="flex flex-wrap items-end gap-3">
      <input type="hidden" name="teamSlug" value={teamSlug} />
      <label className="text-sm font-medium">
        E-mail<br />
        <input name="email" type="email" required className={`${field} w-72`} />
      </label>
      <label className="text-sm font-medium">
        Role<br />
        <select name="role" defaultValue="viewer" className={field}>
          {ROLES.map((r) => <option key={r} value={r}>{r}</option>)}
        </select>
      </label>
      <button type="submit" disabled={pending}
        className="rounded bg-copper px-3 py-1.5 text-sm font-medium text-white hover:bg-copper-dark disabled:opacity-60">Invite</button>
      <p aria-live="polite" className={`w-full text-sm ${state.ok === false ? "text-brick" : "text-verdigris"}`}>{state.message}</p>
    </form>
  );
}

export function WithdrawForm({ teamSlug, id }: { teamSlug: string; id: number }) {
  const [state, action, pending] = useActionState(withdrawAction, {});
  return (
    <form action={action}>
      <input type="hidden" name="teamSlug" value={teamSlug} />
      <input type="hidden" name="id" value={id} />
      <button type="submit" disabled={pending} className="text-sm text-brick hover:underline disabled:opacity-60">Withdraw</button>
      {state.ok === false ? <span className="ml-2 text-xs text-brick">{state.message}</span> : null}
    </form>
  );
}
