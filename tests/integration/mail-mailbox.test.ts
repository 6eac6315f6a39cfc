import { afterAll, describe, expect, it } from "vitest";
import { MembershipSchema, TeamSchema, UserSchema } from "@/entities";
import { inviteMember } from "@/lib/auth/invitations";
import { loadCaller } from "@/lib/auth/load-caller";
import { closeOrm, getEm } from "@/lib/db/orm";
import { visibleMail } from "@/lib/mail/mailbox-access";
import type { StoredMail } from "@/lib/mail/sink";
import { mailsTo, makeTeam } from "./auth-fixtures";
import { contextFor } from "@/lib/context";

afterAll(closeOrm);

const mailTo = (to: string): StoredMail => ({
  id: to, receivedAt: new Date().toISOString(), envelope: { from: "assay@assay.test", to: [to] }, from: "", to: [to], subject: "s", text: "t", html: null,
});

describe("who may read the local mailbox", () => {
  it("shows an admin mail for their own people and invitees, never for someone who is also in another team", async () => {
    const a = await makeTeam(["admin", "author", "viewer"]);
    const b = await makeTeam(["admin"]);
    const em = await getEm();
    // people[2] of team a is also in team b: a's admin must not read that person's sign-in links.
    em.create(MembershipSchema, { user: em.getReference(UserSchema, a.people[2].id), team: em.getReference(TeamSchema, b.teamId), role: "viewer", createdAt: new Date() });
    await em.flush();
    const admin = await loadCaller(await getEm(), a.people[0].id);
    const invitee = `inv-${a.tag}@larkspur.test`;
    await inviteMember(await contextFor(admin), { teamSlug: a.slug, email: invitee, role: "viewer" });
    expect(mailsTo(invitee)).toHaveLength(1);

    const box = [a.people[0].email, a.people[1].email, a.people[2].email, b.people[0].email, invitee, `stranger-${a.tag}@x.test`].map(mailTo);
    const seen = (await visibleMail(await contextFor(admin), box)).map((m) => m.envelope.to[0]);
    expect(seen).toEqual([a.people[0].email, a.people[1].email, invitee]);

    const author = await loadCaller(await getEm(), a.people[1].id);
    expect(await visibleMail(await contextFor(author), box)).toEqual([]);
  });
});
