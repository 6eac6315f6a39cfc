import { describe, expect, it } from "vitest";
import type { Caller } from "@/lib/auth/caller";
import { anonymous } from "@/lib/auth/caller";
import { assertCan, can } from "@/lib/auth/permissions";

// Expected rights are DESIGN.md's role table (viewer < author < maintainer < admin, per team).
const member = (role: "viewer" | "author" | "maintainer" | "admin", teamId = 1, id = 7): Caller => ({
  user: { id, email: "x@fenwick.test", name: "X" },
  memberships: [{ teamId, teamSlug: "fenwick", role }],
  token: null,
});
const teamBlock = { kind: "block" as const, teamId: 1, visibility: "team" as const, authorId: 7 };
const publicBlock = { ...teamBlock, visibility: "public" as const };

describe("permissions", () => {
  it("lets anyone read a public block and nobody outside read a team block", () => {
    expect(can(anonymous, "block.read", publicBlock)).toBe(true);
    expect(can(anonymous, "block.read", teamBlock)).toBe(false);
    expect(can(member("admin", 2), "block.read", teamBlock)).toBe(false);
    expect(() => assertCan(member("admin", 2), "block.read", teamBlock)).toThrow(/no such block/);
  });
  it("follows the role ladder", () => {
    expect(can(member("viewer"), "block.create", { kind: "team", teamId: 1 })).toBe(false);
    expect(can(member("author"), "block.create", { kind: "team", teamId: 1 })).toBe(true);
    expect(can(member("author"), "version.approve", teamBlock)).toBe(false);
    expect(can(member("maintainer"), "version.approve", teamBlock)).toBe(true);
    expect(can(member("maintainer"), "team.manage", { kind: "team", teamId: 1 })).toBe(false);
    expect(can(member("admin"), "team.manage", { kind: "team", teamId: 1 })).toBe(true);
  });
  it("lets authors edit only their own blocks, maintainers any", () => {
    expect(can(member("author", 1, 7), "block.edit", teamBlock)).toBe(true);
    expect(can(member("author", 1, 8), "block.edit", teamBlock)).toBe(false);
    expect(can(member("maintainer", 1, 8), "block.edit", teamBlock)).toBe(true);
  });
  it("intersects a token's scope with its user's role", () => {
    const readToken: Caller = { ...member("admin"), token: { id: 1, teamId: 1, scope: "read" } };
    expect(can(readToken, "block.read", teamBlock)).toBe(true);
    expect(can(readToken, "block.create", { kind: "team", teamId: 1 })).toBe(false);
    const writeToken: Caller = { ...member("viewer"), token: { id: 1, teamId: 1, scope: "write" } };
    expect(can(writeToken, "block.create", { kind: "team", teamId: 1 })).toBe(false);
    const otherTeam: Caller = { ...member("admin"), token: { id: 1, teamId: 2, scope: "write" } };
    expect(can(otherTeam, "block.read", teamBlock)).toBe(false);
  });
});
