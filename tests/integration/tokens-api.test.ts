import { afterAll, describe, expect, it } from "vitest";
import { createHash } from "node:crypto";
import { ApiTokenSchema } from "@/entities";
import { loadCaller } from "@/lib/auth/load-caller";
import { assertCan } from "@/lib/auth/permissions";
import { callerFromRequest } from "@/lib/auth/request-caller";
import { contextFor } from "@/lib/context";
import { closeOrm, getEm } from "@/lib/db/orm";
import { createOwnToken, listTokens, revokeTokenAs } from "@/lib/tokens/manage";
import { createToken } from "@/lib/tokens/tokens";
import { makeTeam, sessionCookie } from "./auth-fixtures";

afterAll(closeOrm);

const bearer = (token: string) => new Request("http://x/api/v1/blocks", { headers: { authorization: `Bearer ${token}` } });

describe("API tokens", () => {
  it("is shown once, stored only as its sha256 with a display prefix", async () => {
    const { teamId, people } = await makeTeam(["author"]);
    const { token, record } = await createToken(await getEm(), { userId: people[0].id, teamId, name: "ci", scope: "read", expiresAt: null });
    expect(token).toMatch(/^asy_[A-Za-z0-9_-]{43}$/);
    expect(record.hash).toBe(createHash("sha256").update(token).digest("hex"));
    // Nothing in the table holds the token: read the raw rows, every column.
    const rows = await (await getEm()).getConnection().execute("select * from api_tokens");
    expect(JSON.stringify(rows)).not.toContain(token);
    expect(JSON.stringify(rows)).not.toContain(token.slice(4));
    expect(record.prefix).toBe(token.slice(0, 12));
    // Listing never returns the token either.
    const me = await loadCaller(await getEm(), people[0].id);
    expect(JSON.stringify(await listTokens(await contextFor(me)))).not.toContain(token);
  });

  it("answers 401 to malformed, unknown, revoked and expired tokens", async () => {
    const { teamId, people } = await makeTeam(["author"]);
    for (const bad of ["nope", "asy_short", `asy_${"A".repeat(43)}`]) {
      await expect(callerFromRequest(bearer(bad))).rejects.toMatchObject({ code: "unauthenticated", status: 401 });
    }
    await expect(callerFromRequest(new Request("http://x", { headers: { authorization: "Basic abc" } }))).rejects.toMatchObject({ status: 401 });

    const em = await getEm();
    const live = await createToken(em, { userId: people[0].id, teamId, name: "a", scope: "write", expiresAt: new Date(Date.now() + 60_000) });
    const caller = await callerFromRequest(bearer(live.token));
    expect(caller.user?.id).toBe(people[0].id);
    expect(caller.token).toEqual({ id: live.record.id, teamId, scope: "write" });

    const owner = await loadCaller(await getEm(), people[0].id);
    await revokeTokenAs(await contextFor(owner), { id: live.record.id });
    await expect(callerFromRequest(bearer(live.token))).rejects.toMatchObject({ status: 401, message: expect.stringMatching(/revoked/) });

    const old = await createToken(await getEm(), { userId: people[0].id, teamId, name: "b", scope: "read", expiresAt: new Date(Date.now() - 1000) });
    await expect(callerFromRequest(bearer(old.token))).rejects.toMatchObject({ status: 401, message: expect.stringMatching(/expired/) });
  });

  it("caps rights by scope and team: read on a write action → 403, another team's block → 404", async () => {
    const a = await makeTeam(["admin"]);
    const b = await makeTeam(["admin"]);
    const read = await createToken(await getEm(), { userId: a.people[0].id, teamId: a.teamId, name: "r", scope: "read", expiresAt: null });
    const caller = await callerFromRequest(bearer(read.token));
    const block = { kind: "block" as const, teamId: a.teamId, visibility: "team" as const, authorId: a.people[0].id };
    expect(() => assertCan(caller, "block.read", block)).not.toThrow();
    expect(() => assertCan(caller, "block.edit", block)).toThrow(expect.objectContaining({ status: 403 }));
    expect(() => assertCan(caller, "block.create", { kind: "team", teamId: a.teamId })).toThrow(expect.objectContaining({ status: 403 }));
    const otherBlock = { ...block, teamId: b.teamId };
    expect(() => assertCan(caller, "block.read", otherBlock)).toThrow(expect.objectContaining({ status: 404 }));
  });

  it("records lastUsedAt at most once a minute", async () => {
    const { teamId, people } = await makeTeam(["viewer"]);
    const t = await createToken(await getEm(), { userId: people[0].id, teamId, name: "c", scope: "read", expiresAt: null });
    await callerFromRequest(bearer(t.token));
    const first = (await (await getEm()).findOneOrFail(ApiTokenSchema, { id: t.record.id })).lastUsedAt;
    expect(first).toBeInstanceOf(Date);
    await callerFromRequest(bearer(t.token));
    const second = (await (await getEm()).findOneOrFail(ApiTokenSchema, { id: t.record.id })).lastUsedAt;
    expect(second?.getTime()).toBe(first!.getTime());
  });

  it("lets members make tokens for their own teams and admins revoke any token of their team", async () => {
    const { slug, teamId, people } = await makeTeam(["admin", "viewer", "author"]);
    const viewer = await loadCaller(await getEm(), people[1].id);
    const made = await createOwnToken(await contextFor(viewer), { teamSlug: slug, name: "bench", scope: "read", expiresInDays: 30 });
    const stranger = await makeTeam(["admin"]);
    await expect(createOwnToken(await contextFor(viewer), { teamSlug: stranger.slug, name: "x", scope: "read", expiresInDays: 0 }))
      .rejects.toMatchObject({ status: 404 });
    const author = await loadCaller(await getEm(), people[2].id);
    await expect(revokeTokenAs(await contextFor(author), { id: made.id })).rejects.toMatchObject({ status: 404 });
    const admin = await loadCaller(await getEm(), people[0].id);
    expect((await listTokens(await contextFor(admin))).map((t) => t.id)).toContain(made.id);
    await revokeTokenAs(await contextFor(admin), { id: made.id });
    await expect(callerFromRequest(bearer(made.token))).rejects.toMatchObject({ status: 401 });
    // A token cannot mint tokens.
    const t = await createToken(await getEm(), { userId: people[0].id, teamId, name: "w", scope: "write", expiresAt: null });
    const viaToken = await callerFromRequest(bearer(t.token));
    await expect(createOwnToken(await contextFor(viaToken), { teamSlug: slug, name: "y", scope: "write", expiresInDays: 0 })).rejects.toMatchObject({ status: 403 });
  });

  it("reads the session cookie from a plain Request, and ignores one signed with another secret", async () => {
    const { slug, people } = await makeTeam(["maintainer"]);
    const cookie = await sessionCookie(String(people[0].id));
    const caller = await callerFromRequest(new Request("http://x", { headers: { cookie: `theme=dark; ${cookie}` } }));
    expect(caller.memberships).toEqual([expect.objectContaining({ teamSlug: slug, role: "maintainer" })]);
    expect(caller.token).toBeNull();
    const forged = cookie.replace(/=.*/, "=eyJhbGciOiJkaXIiLCJlbmMiOiJBMjU2R0NNIn0..forged.forged.forged");
    expect((await callerFromRequest(new Request("http://x", { headers: { cookie: forged } }))).user).toBeNull();
    expect((await callerFromRequest(new Request("http://x"))).user).toBeNull();
  });
});
