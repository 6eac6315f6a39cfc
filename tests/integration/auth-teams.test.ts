import { afterAll, describe, expect, it } from "vitest";
import { loadCaller } from "@/lib/auth/load-caller";
import { changeRole, listMembers, removeMember } from "@/lib/auth/teams";
import { closeOrm, getEm } from "@/lib/db/orm";
import { makeTeam } from "./auth-fixtures";

afterAll(closeOrm);

describe("members and roles", () => {
  it("never lets a team lose its last admin", async () => {
    const { slug, people } = await makeTeam(["admin", "author"]);
    const admin = await loadCaller(await getEm(), people[0].id);
    await expect(changeRole(await getEm(), admin, slug, people[0].id, "maintainer")).rejects.toMatchObject({ code: "conflict" });
    await expect(removeMember(await getEm(), admin, slug, people[0].id)).rejects.toMatchObject({ code: "conflict" });

    // With a second admin, the first may step down; then the second is the last one.
    await changeRole(await getEm(), admin, slug, people[1].id, "admin");
    await changeRole(await getEm(), admin, slug, people[0].id, "viewer");
    const second = await loadCaller(await getEm(), people[1].id);
    expect((await listMembers(await getEm(), second, slug)).map((m) => m.role).sort()).toEqual(["admin", "viewer"]);
    await expect(removeMember(await getEm(), second, slug, people[1].id)).rejects.toMatchObject({ code: "conflict" });
    // The demoted admin lost the right at once (roles are read from the database per request).
    const demoted = await loadCaller(await getEm(), people[0].id);
    await expect(changeRole(await getEm(), demoted, slug, people[1].id, "viewer")).rejects.toMatchObject({ code: "forbidden" });
  });

  it("lets admins remove members and refuses everyone else", async () => {
    const { slug, people } = await makeTeam(["admin", "maintainer", "viewer"]);
    const maintainer = await loadCaller(await getEm(), people[1].id);
    await expect(removeMember(await getEm(), maintainer, slug, people[2].id)).rejects.toMatchObject({ code: "forbidden" });
    await expect(listMembers(await getEm(), maintainer, slug)).rejects.toMatchObject({ code: "forbidden" });
    const admin = await loadCaller(await getEm(), people[0].id);
    await removeMember(await getEm(), admin, slug, people[2].id);
    expect((await loadCaller(await getEm(), people[2].id)).memberships).toEqual([]);
  });
});
