import { readdirSync, readFileSync } from "node:fs";
import { afterAll, describe, expect, it, vi } from "vitest";

await vi.hoisted(async () => { await (await import("./blocks-db")).usePrivateDatabase(); });
import { BlockSchema, BlockVersionSchema, CheckRunSchema, ModelSchema, ReviewSchema, TeamSchema, UserSchema } from "@/entities";
import { anonymous } from "@/lib/auth/caller";
import { loadCaller } from "@/lib/auth/load-caller";
import { compareVersions } from "@/lib/blocks/compare";
import { getLineage } from "@/lib/blocks/read";
import { closeOrm, getEm } from "@/lib/db/orm";
import { seedLibrary } from "@/lib/seed/seed-library";
import { seedPeople } from "@/lib/seed/seed-people";
import { contextFor } from "@/lib/context";

afterAll(closeOrm);

describe("demo library seed", () => {
  it("imports every content block into fenwick with a fork, a second version and an approval; a second run creates nothing", { timeout: 120_000 }, async () => {
    await seedPeople(await getEm());
    // content/blocks, and the blocks that include Fenwick's own model files (content/team/fenwick/blocks).
    const files = [
      ...readdirSync("content/blocks").filter((f) => f.endsWith(".md")).map((f) => `content/blocks/${f}`),
      ...readdirSync("content/team/fenwick/blocks").filter((f) => f.endsWith(".md")).map((f) => `content/team/fenwick/blocks/${f}`),
    ];
    // Other test files may add fenwick blocks of their own: look only at the seeded slugs.
    const slugs = [...files.map((f) => /^slug:\s*([a-z0-9-]+)/m.exec(readFileSync(f, "utf8"))![1]), "rc-lowpass-antialias-5k1"];
    const first = await seedLibrary(await getEm());
    const em = await getEm();
    const fenwick = await em.findOneOrFail(TeamSchema, { slug: "fenwick" });
    const blocks = await em.find(BlockSchema, { team: fenwick, slug: { $in: slugs } }, { populate: ["head", "head.author"] });
    // Every file is a block (none refused), plus the fork.
    expect(blocks.length).toBe(files.length + 1);
    expect(first.created).toBe(files.length + 1);
    expect(blocks.every((b) => b.head)).toBe(true);
    expect(new Set(blocks.map((b) => b.head!.author.email))).toEqual(new Set(["nadia.okafor@fenwick.test"]));
    expect(blocks.filter((b) => b.visibility === "public").length).toBeGreaterThanOrEqual(3);
    const fork = blocks.find((b) => b.forkedFrom)!;
    expect(fork.slug).toBe("rc-lowpass-antialias-5k1");
    expect(fork.head!.params.find((p) => p.name === "R")?.value).toBe("5.1 kohm");
    expect(await em.count(BlockVersionSchema, { block: { slug: "rc-lowpass-antialias" } } as never)).toBe(2);
    const tomas = await em.findOneOrFail(UserSchema, { email: "tomas.reyes@fenwick.test" });
    const fenwickCaller = await loadCaller(await getEm(), tomas.id);
    // The fork is a team block: the team sees it in the parent's lineage, a signed-out reader of the public parent does not.
    expect((await getLineage(await contextFor(fenwickCaller), { slug: "rc-lowpass-antialias" })).forks.map((f) => f.slug)).toEqual(["rc-lowpass-antialias-5k1"]);
    expect((await getLineage(await contextFor(anonymous), { slug: "rc-lowpass-antialias" })).forks).toEqual([]);
    expect((await getLineage(await contextFor(fenwickCaller), { slug: "rc-lowpass-antialias-5k1" })).parentNewerVersions).toBe(1);
    expect((await compareVersions(await contextFor(anonymous), { slug: "rc-lowpass-antialias", a: 1, b: 2 })).params.map((p) => p.name)).toEqual(["R", "C"]);
    expect(await em.count(ReviewSchema, { decision: "approved", version: { block: { slug: "wien-bridge-sine-1k" } } } as never)).toBe(1);
    // The retuned low-pass: v1 approved, v2 waiting for sign-off.
    const lowpassReviews = await em.find(ReviewSchema, { version: { block: { slug: "rc-lowpass-antialias" } } } as never, { populate: ["version"], orderBy: { id: "asc" } });
    expect(lowpassReviews.map((r) => [r.version.number, r.decision])).toEqual([[1, "approved"], [2, "requested"]]);
    const runs = await em.count(CheckRunSchema, { version: { block: { slug: { $in: slugs } } } } as never);
    expect(runs).toBe(files.length + 2);

    // Fenwick's model files are uploaded once, as version 1.
    const models = await em.find(ModelSchema, { team: fenwick }, { populate: ["head"] });
    expect(models.map((m) => [m.name, m.head!.number]).sort()).toEqual([["fwk-d1s.lib", 1], ["fwk-opa1.lib", 1]]);

    const second = await seedLibrary(await getEm());
    expect(second.created).toBe(0);
    const em2 = await getEm();
    expect(await em2.count(BlockSchema, { team: fenwick, slug: { $in: slugs } })).toBe(files.length + 1);
    expect(await em2.count(CheckRunSchema, { version: { block: { slug: { $in: slugs } } } } as never)).toBe(runs);
    expect(await em2.count(ReviewSchema, { version: { block: { slug: { $in: slugs } } } } as never)).toBe(3);
  });
});
