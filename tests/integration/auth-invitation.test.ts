import { afterAll, describe, expect, it } from "vitest";
import { InvitationSchema, MembershipSchema, UserSchema } from "@/entities";
import { authOptions } from "@/lib/auth/auth-options";
import { loadCaller } from "@/lib/auth/load-caller";
import { acceptInvitation, describeInvitation, inviteMember } from "@/lib/auth/invitations";
import { authorizePassword } from "@/lib/auth/sign-in";
import { closeOrm, getEm } from "@/lib/db/orm";
import { linkIn, mailsTo, makeTeam } from "./auth-fixtures";
import { contextFor } from "@/lib/context";

afterAll(closeOrm);

type Authorize = (c: Record<string, string>, req: { headers: Record<string, string> }) => Promise<{ id: string; email: string } | null>;
// next-auth merges `options` over the provider's defaults at run time; the id and authorize live there.
const provider = (id: string) =>
  (authOptions().providers as unknown as { options: { id: string; authorize: Authorize } }[]).find((p) => p.options.id === id)!.options.authorize;

describe("sign-up by invitation", () => {
  it("invites a new address, which accepts with name and password and lands signed in", async () => {
    const { slug, people } = await makeTeam(["admin"]);
    const admin = await loadCaller(await getEm(), people[0].id);
    const invitee = `new-${slug}@larkspur.test`;
    await inviteMember(await contextFor(admin), { teamSlug: slug, email: invitee, role: "author" });

    const [mail] = mailsTo(invitee);
    expect(mail.subject).toContain(`Team ${slug.slice(2)}`);
    expect(mail.text).toContain("as author");
    expect(mail.html).toContain("/invitation?token=");
    const token = linkIn(mail).searchParams.get("token")!;
    const em = await getEm();
    expect(JSON.stringify(await em.find(InvitationSchema, { email: invitee }))).not.toContain(token);
    expect(await describeInvitation(await contextFor(), { token })).toMatchObject({ email: invitee, role: "author", hasAccount: false });

    // A new account needs a usable password; the refusal leaves the invitation usable.
    await expect(provider("invitation")({ token, name: "Ada Quill", password: "short" }, { headers: {} })).rejects.toThrow(/10 characters/);
    const signedIn = await provider("invitation")({ token, name: "Ada Quill", password: "a long enough secret" }, { headers: {} });
    expect(signedIn?.email).toBe(invitee);

    const caller = await loadCaller(await getEm(), Number(signedIn!.id));
    expect(caller.user?.name).toBe("Ada Quill");
    expect(caller.memberships.map((m) => [m.teamSlug, m.role])).toEqual([[slug, "author"]]);
    await expect(authorizePassword(await contextFor(), { email: invitee, password: "a long enough secret" }, "10.2.0.1")).resolves.toMatchObject({ email: invitee });

    // Used once.
    await expect(acceptInvitation(await contextFor(), { token, name: "Again", password: "a long enough secret" })).rejects.toMatchObject({ code: "unauthenticated" });
    expect(await describeInvitation(await contextFor(), { token })).toBeNull();
  });

  it("adds a membership to an existing account without touching its password", async () => {
    const a = await makeTeam(["admin"]);
    const b = await makeTeam(["viewer"]);
    const admin = await loadCaller(await getEm(), a.people[0].id);
    const existing = b.people[0];
    await inviteMember(await contextFor(admin), { teamSlug: a.slug, email: existing.email, role: "maintainer" });
    const token = linkIn(mailsTo(existing.email)[0]).searchParams.get("token")!;
    const before = (await (await getEm()).findOneOrFail(UserSchema, { id: existing.id })).passwordHash;
    await acceptInvitation(await contextFor(), { token });
    const caller = await loadCaller(await getEm(), existing.id);
    expect(caller.memberships.map((m) => [m.teamSlug, m.role]).sort()).toEqual([[a.slug, "maintainer"], [b.slug, "viewer"]].sort());
    expect((await (await getEm()).findOneOrFail(UserSchema, { id: existing.id })).passwordHash).toBe(before);
  });

  it("lets only admins invite, and refuses an expired invitation", async () => {
    const { slug, people } = await makeTeam(["admin", "maintainer"]);
    const maintainer = await loadCaller(await getEm(), people[1].id);
    await expect(inviteMember(await contextFor(maintainer), { teamSlug: slug, email: `m-${slug}@fenwick.test`, role: "viewer" }))
      .rejects.toMatchObject({ code: "forbidden" });
    const outsider = await loadCaller(await getEm(), (await makeTeam(["admin"])).people[0].id);
    await expect(inviteMember(await contextFor(outsider), { teamSlug: slug, email: `o-${slug}@fenwick.test`, role: "viewer" }))
      .rejects.toMatchObject({ code: "not_found" });

    const admin = await loadCaller(await getEm(), people[0].id);
    const late = `late-${slug}@fenwick.test`;
    await inviteMember(await contextFor(admin), { teamSlug: slug, email: late, role: "viewer" });
    const token = linkIn(mailsTo(late)[0]).searchParams.get("token")!;
    const eightDaysOn = new Date(Date.now() + 8 * 86400_000);
    await expect(acceptInvitation(await contextFor(), { token, name: "Late", password: "a long enough secret" }, eightDaysOn))
      .rejects.toMatchObject({ code: "unauthenticated" });
    expect(await (await getEm()).count(MembershipSchema, { user: { email: late } })).toBe(0);
  });
});
