import { afterAll, describe, expect, it } from "vitest";
import { SignInLinkSchema } from "@/entities";
import { callerFromRequest } from "@/lib/auth/request-caller";
import { authorizePassword, redeemSignInLink, requestSignInLink } from "@/lib/auth/sign-in";
import { closeOrm, getEm } from "@/lib/db/orm";
import { PASSWORD, linkIn, mailsTo, makeTeam, sessionCookie } from "./auth-fixtures";
import { contextFor } from "@/lib/context";

afterAll(closeOrm);

describe("sign-in by e-mail link through the mail sink", () => {
  it("mails a one-time link that signs the person in, once", async () => {
    const { people, slug } = await makeTeam(["author"]);
    const me = people[0];
    await requestSignInLink(await contextFor(), { email: me.email.toUpperCase() }, "10.1.0.1");
    const [mail] = mailsTo(me.email);
    expect(mail.subject).toMatch(/sign-in link/i);
    expect(mail.html).toContain("/sign-in/link?token=");
    const url = linkIn(mail);
    expect(url.origin).toBe(new URL(process.env.APP_URL!).origin);
    expect(url.pathname).toBe("/sign-in/link");
    expect([...url.searchParams.keys()]).toEqual(["token"]);
    const token = url.searchParams.get("token")!;

    // Only the hash is kept.
    const em = await getEm();
    const rows = await em.find(SignInLinkSchema, { email: me.email });
    expect(rows).toHaveLength(1);
    expect(JSON.stringify(rows)).not.toContain(token);

    const signedIn = await redeemSignInLink(await contextFor(), { token }, "10.1.0.1");
    expect(signedIn.email).toBe(me.email);
    const caller = await callerFromRequest(new Request("http://x/api/v1/blocks", { headers: { cookie: await sessionCookie(signedIn.id) } }));
    expect(caller.user?.email).toBe(me.email);
    expect(caller.memberships).toEqual([{ teamId: expect.any(Number), teamSlug: slug, role: "author" }]);

    await expect(redeemSignInLink(await contextFor(), { token }, "10.1.0.1")).rejects.toMatchObject({ code: "unauthenticated" });
  });

  it("refuses an expired link and a made-up one", async () => {
    const { people } = await makeTeam(["viewer"]);
    const me = people[0];
    await requestSignInLink(await contextFor(), { email: me.email }, "10.1.0.2");
    const token = linkIn(mailsTo(me.email)[0]).searchParams.get("token")!;
    const sixteenMinutesOn = new Date(Date.now() + 16 * 60_000);
    await expect(redeemSignInLink(await contextFor(), { token }, "10.1.0.2", sixteenMinutesOn)).rejects.toMatchObject({ code: "unauthenticated" });
    await expect(redeemSignInLink(await contextFor(), { token: "x".repeat(43) }, "10.1.0.2")).rejects.toMatchObject({ code: "unauthenticated" });
    // Within the 15 minutes it still works.
    const fourteenMinutesOn = new Date(Date.now() + 14 * 60_000);
    await expect(redeemSignInLink(await contextFor(), { token }, "10.1.0.2", fourteenMinutesOn)).resolves.toMatchObject({ email: me.email });
  });

  it("sends nothing for an unknown address and says nothing either", async () => {
    const nobody = `nobody-${Date.now()}@fenwick.test`;
    await expect(requestSignInLink(await contextFor(), { email: nobody }, "10.1.0.3")).resolves.toBeUndefined();
    expect(mailsTo(nobody)).toHaveLength(0);
  });

  it("signs in with e-mail and password, refusing a wrong password with the same words as an unknown address", async () => {
    const { people } = await makeTeam(["viewer"]);
    const ok = await authorizePassword(await contextFor(), { email: people[0].email, password: PASSWORD }, "10.1.0.4");
    expect(ok.email).toBe(people[0].email);
    const wrong = authorizePassword(await contextFor(), { email: people[0].email, password: "not it at all" }, "10.1.0.4");
    await expect(wrong).rejects.toThrow("That e-mail and password do not match.");
    const unknown = authorizePassword(await contextFor(), { email: `x-${Date.now()}@fenwick.test`, password: PASSWORD }, "10.1.0.4");
    await expect(unknown).rejects.toThrow("That e-mail and password do not match.");
  });
});
