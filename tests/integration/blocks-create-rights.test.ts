import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { BlockSchema } from "@/entities";
import { loadCaller } from "@/lib/auth/load-caller";
import { createBlock } from "@/lib/blocks/create";
import { contextFor } from "@/lib/context";
import { closeOrm, getEm } from "@/lib/db/orm";
import { contentBlock, makeTeam, type TestTeam } from "./blocks-helpers";

// DESIGN.md "Roles": maintainers publish (visibility public), at creation as later; "REST API": a token's own
// team is the default where a route takes `team`.
let team: TestTeam;
beforeAll(async () => { team = await makeTeam(); });
afterAll(closeOrm);
const file = (slug: string) => contentBlock("rc-lowpass-antialias.md", slug);

describe("creating a block", () => {
  it("public only by a maintainer: an author is refused and nothing is stored", async () => {
    const slug = `pub-${team.tag}`;
    await expect(createBlock(await contextFor(team.author), { team: team.slug, text: file(slug), visibility: "public" })).rejects.toMatchObject({ code: "forbidden" });
    expect(await (await getEm()).count(BlockSchema, { slug })).toBe(0);
    await expect(createBlock(await contextFor(team.maintainer), { team: team.slug, text: file(slug), visibility: "public" })).resolves.toMatchObject({ version: 1 });
    expect((await (await getEm()).findOneOrFail(BlockSchema, { slug })).visibility).toBe("public");
  });

  it("in the token's own team when no team is named", async () => {
    const byToken = await loadCaller(await getEm(), team.author.user!.id, { id: 1, teamId: team.id, scope: "write" });
    const slug = `tok-${team.tag}`;
    await expect(createBlock(await contextFor(byToken), { text: file(slug) })).resolves.toMatchObject({ slug, version: 1 });
    const block = await (await getEm()).findOneOrFail(BlockSchema, { slug }, { populate: ["team"] });
    expect(block.team.slug).toBe(team.slug);
  });
});
