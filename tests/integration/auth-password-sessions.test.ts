import { afterAll, describe, expect, it } from "vitest";
import { UserSchema } from "@/entities";
import { loadCaller } from "@/lib/auth/load-caller";
import { verifyPassword } from "@/lib/auth/passwords";
import { changePassword } from "@/lib/auth/profile";
import { callerFromCookieHeader, callerFromRequest } from "@/lib/auth/request-caller";
import { claimsOf, sessionCookieFor } from "@/lib/auth/session-token";
import { createToken } from "@/lib/tokens/tokens";
import { closeOrm, getEm } from "@/lib/db/orm";
import { PASSWORD, makeTeam } from "./auth-fixtures";
import { contextFor } from "@/lib/context";

afterAll(closeOrm);

const cookieAt = async (user: { id: number; email: string }, at: Date) => {
  const c = await sessionCookieFor({ ...user, name: "someone" }, at);
  return `${c.name}=${c.value}`;
};

describe("a password change ends the other sessions", () => {
  it("turns a cookie that signed in before the change into nobody, and keeps one signed in at the change", async () => {
    const { people } = await makeTeam(["author"]);
    const me = people[0];
    const elsewhere = await cookieAt(me, new Date(Date.now() - 60_000)); // another browser, a minute ago
    expect((await callerFromCookieHeader(elsewhere)).user?.id).toBe(me.id);

    const caller = await loadCaller(await getEm(), me.id);
    const at = await changePassword(await contextFor(caller), { current: PASSWORD, next: "a new passphrase, long" });
    const row = await (await getEm()).findOneOrFail(UserSchema, { id: me.id });
    expect(row.sessionsValidFrom?.getTime()).toBe(at.getTime());
    expect(await verifyPassword("a new passphrase, long", row.passwordHash!)).toBe(true);

    expect(await callerFromCookieHeader(elsewhere)).toMatchObject({ user: null, memberships: [] });
    expect((await callerFromRequest(new Request("http://x/", { headers: { cookie: elsewhere } }))).user).toBeNull();
    // The browser that made the change is signed in again at that moment, and later sign-ins count as usual.
    expect((await callerFromCookieHeader(await cookieAt(me, at))).user?.id).toBe(me.id);
    expect((await callerFromCookieHeader(await cookieAt(me, new Date(at.getTime() + 5_000)))).memberships).toHaveLength(1);
  });

  it("refuses the change with a wrong current password and leaves the sessions alone", async () => {
    const { people } = await makeTeam(["viewer"]);
    const cookie = await cookieAt(people[0], new Date(Date.now() - 1_000));
    const caller = await loadCaller(await getEm(), people[0].id);
    await expect(changePassword(await contextFor(caller), { current: "not my password", next: "a new passphrase, long" })).rejects.toMatchObject({ code: "validation" });
    expect((await callerFromCookieHeader(cookie)).user?.id).toBe(people[0].id);
  });

  it("does not touch API tokens, which are revoked on their own", async () => {
    const { people, teamId } = await makeTeam(["author"]);
    const { token } = await createToken(await getEm(), { userId: people[0].id, teamId, name: "ci", scope: "read", expiresAt: null });
    await changePassword(await contextFor(await loadCaller(await getEm(), people[0].id)), { current: PASSWORD, next: "a new passphrase, long" });
    const byToken = await callerFromRequest(new Request("http://x/", { headers: { authorization: `Bearer ${token}` } }));
    expect(byToken.user?.id).toBe(people[0].id);
  });

  it("dates a cookie from before the sign-in claim by its iat", () => {
    expect(claimsOf({ sub: "7", iat: 1_700_000_000 })).toEqual({ userId: 7, signedInAt: 1_700_000_000_000 });
    expect(claimsOf({ sub: "7", iat: 1_700_000_000, signedInAt: 1_700_000_123_456 })?.signedInAt).toBe(1_700_000_123_456);
    expect(claimsOf({ sub: "nobody" })).toBeNull();
    expect(claimsOf(null)).toBeNull();
  });
});
