import { afterAll, describe, expect, it } from "vitest";
import { spawnSync } from "node:child_process";
import { createHash } from "node:crypto";
import { ApiTokenSchema, MembershipSchema, TeamSchema, UserSchema } from "@/entities";
import { closeOrm, getEm } from "@/lib/db/orm";
import { makeTeam } from "./auth-fixtures";

afterAll(closeOrm);

// The CLI as scripts and admins run it: `npm run -s token -- EMAIL [--team SLUG] [--write]`.
const run = (...args: string[]) =>
  spawnSync("npm", ["run", "-s", "token", "--", ...args], { encoding: "utf8", env: process.env, timeout: 60_000 });

describe("npm run token", () => {
  it("prints only a new token, read by default, write with --write", async () => {
    const { people, teamId } = await makeTeam(["author"]);
    const r = run(people[0].email);
    expect(r.status, r.stderr).toBe(0);
    expect(r.stdout).toMatch(/^asy_[A-Za-z0-9_-]{43}\n$/);
    const hash = createHash("sha256").update(r.stdout.trim()).digest("hex");
    const row = await (await getEm()).findOneOrFail(ApiTokenSchema, { hash });
    expect([row.scope, row.team.id, row.user.id]).toEqual(["read", teamId, people[0].id]);
    const w = run(people[0].email, "--write");
    const wrow = await (await getEm()).findOneOrFail(ApiTokenSchema, { hash: createHash("sha256").update(w.stdout.trim()).digest("hex") });
    expect(wrow.scope).toBe("write");
  });

  it("needs --team for someone in several teams, and refuses unknown people", async () => {
    const a = await makeTeam(["viewer"]);
    const b = await makeTeam(["admin"]);
    const em = await getEm();
    em.create(MembershipSchema, {
      user: em.getReference(UserSchema, a.people[0].id), team: em.getReference(TeamSchema, b.teamId), role: "author", createdAt: new Date(),
    });
    await em.flush();
    const both = run(a.people[0].email);
    expect(both.status).toBe(2);
    expect(both.stdout).toBe("");
    expect(both.stderr).toMatch(/several teams.*--team/);
    const chosen = run(a.people[0].email, "--team", b.slug);
    expect(chosen.status).toBe(0);
    const row = await (await getEm()).findOneOrFail(ApiTokenSchema, { hash: createHash("sha256").update(chosen.stdout.trim()).digest("hex") });
    expect(row.team.id).toBe(b.teamId);

    const nobody = run(`nobody-${a.tag}@fenwick.test`);
    expect(nobody.status).toBe(2);
    expect(nobody.stdout).toBe("");
    expect(nobody.stderr).toMatch(/no user/);
  });
});
