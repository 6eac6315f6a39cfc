import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { createBlock } from "@/lib/blocks/create";
import { forkBlock } from "@/lib/blocks/fork";
import { addVersion } from "@/lib/blocks/versions";
import { contextFor } from "@/lib/context";
import { closeOrm } from "@/lib/db/orm";
import { forkBodySchema, newVersionJsonSchema } from "@/lib/validation/blocks";
import { contentBlock, makeTeam, type TestTeam } from "./blocks-helpers";

// What PostgreSQL cannot store (U+0000 in text; PostgreSQL 15 manual §8.3 "Character Types") or does not fit a
// column is refused as a validation error that names the field, never a database error.
let team: TestTeam;
beforeAll(async () => { team = await makeTeam(); });
afterAll(closeOrm);

async function refusal(p: Promise<unknown>) {
  try { await p; } catch (e) { return e as { code: string; message: string; extra: { errors: { path?: string; line?: number }[] } }; }
  throw new Error("expected a refusal");
}
const file = (slug: string) => contentBlock("rc-lowpass-antialias.md", slug);

describe("input the database cannot hold", () => {
  it("refuses a 101-character slug in a block file, naming the field and its line", async () => {
    const e = await refusal(createBlock(await contextFor(team.author), { team: team.slug, text: file("a".repeat(101)) }));
    expect(e.code).toBe("validation");
    expect(e.extra.errors[0]).toMatchObject({ path: "slug", line: 2 });
  });

  it("refuses U+0000 in the note, the netlist and the title, naming each", async () => {
    const base = file(`nul-${team.tag}`);
    const cases: [string, string][] = [
      ["note", base.replace("A single RC pole", "A single\u0000 RC pole")],
      ["netlist", base.replace("R1 in out {R}", "R1 in out {R} \u0000")],
      ["title", base.replace(/^title: (.*)$/m, "title: $1\u0000")],
    ];
    for (const [field, text] of cases) {
      const e = await refusal(createBlock(await contextFor(team.author), { team: team.slug, text }));
      expect([e.code, e.extra.errors[0].path]).toEqual(["validation", field]);
    }
  });

  it("refuses U+0000 in a version message and a fork title at the request schema", () => {
    const msg = newVersionJsonSchema.safeParse({ params: {}, baseVersion: 1, message: "x\u0000" });
    expect(msg.success ? [] : msg.error.issues.map((i) => i.path.join("."))).toEqual(["message"]);
    const title = forkBodySchema.safeParse({ title: "fork\u0000" });
    expect(title.success ? [] : title.error.issues.map((i) => i.path.join("."))).toEqual(["title"]);
  });

  it("still stores a version whose message is plain text", async () => {
    const slug = `ok-${team.tag}`;
    await createBlock(await contextFor(team.author), { team: team.slug, text: file(slug) });
    await expect(addVersion(await contextFor(team.author), { slug, params: { R: "5.1 kohm" }, baseVersion: 1, message: "E24 neighbour" })).resolves.toMatchObject({ version: 2 });
  });
});

describe("concurrent bare forks of one block", () => {
  it("all succeed, each with its own generated slug", async () => {
    const slug = `src-${team.tag}`;
    await createBlock(await contextFor(team.author), { team: team.slug, text: file(slug) });
    const results = await Promise.allSettled(Array.from({ length: 20 }, async () => forkBlock(await contextFor(team.author), { source: slug })));
    const failed = results.filter((r) => r.status === "rejected").map((r) => (r as PromiseRejectedResult).reason.message);
    expect(failed).toEqual([]);
    const slugs = results.map((r) => (r as PromiseFulfilledResult<{ slug: string }>).value.slug);
    expect(new Set(slugs).size).toBe(20);
    expect(slugs).toContain(`${slug}-fork`);
  }, 120_000);
});
