import { afterAll, describe, expect, it } from "vitest";
import { loadCaller } from "@/lib/auth/load-caller";
import { changeRole, listMembers, removeMember } from "@/lib/auth/teams";
import { closeOrm, getEm } from "@/lib/db/orm";
import { makeTeam } from "./auth-fixtures";
import { contextFor } from "@/lib/context";

afterAll(closeOrm);

describe("members and roles", () => {
  it("never lets a team lose its last admin", async () => {
    const { slug, people } = await makeTeam(["admin", "author"]);
    const admin = await loadCaller(await getEm(), people[0].id);
    await expect(changeRole(await contextFor(admin), { teamSlug: slug, userId: people[0].id, role: "maintainer" })).rejects.toMatchObject({ code: "conflict" });
    await expect(removeMember(await contextFor(admin), { teamSlug: slug, userId: people[0].id })).rejects.toMatchObject({ code: "conflict" });

    // With a second admin, the first may step down; then the second is the last one.
    await changeRole(await contextFor(admin), { teamSlug: slug, userId: people[1].id, role: "admin" });
    await changeRole(await contextFor(admin), { teamSlug: slug, userId: people[0].id, role: "viewer" });
    const second = await loadCaller(await getEm(), people[1].id);
    expect((await listMembers(await contextFor(second), { teamSlug: slug })).map((m) => m.role).sort()).toEqual(["admin", "viewer"]);
    await expect(removeMember(await contextFor(second), { teamSlug: slug, userId: people[1].id })).rejects.toMatchObject({ code: "conflict" });
    // The demoted admin lost the right at once (roles are read from the database per request).
    const demoted = await loadCaller(await getEm(), people[0].id);
    await expect(changeRole(await contextFor(demoted), { teamSlug: slug, userId: people[1].id, role: "viewer" })).rejects.toMatchObject({ code: "forbidden" });
  });

  it("lets admins remove members and refuses everyone else", async () => {
    const { slug, people } = await makeTeam(["admin", "maintainer", "viewer"]);
    const maintainer = await loadCaller(await getEm(), people[1].id);
    await expect(removeMember(await contextFor(maintainer), { teamSlug: slug, userId: people[2].id })).rejects.toMatchObject({ code: "forbidden" });
    await expect(listMembers(await contextFor(maintainer), { teamSlug: slug })).rejects.toMatchObject({ code: "forbidden" });
    const admin = await loadCaller(await getEm(), people[0].id);
    await removeMember(await contextFor(admin), { teamSlug: slug, userId: people[2].id });
    expect((await loadCaller(await getEm(), people[2].id)).memberships).toEqual([]);
  });
});
