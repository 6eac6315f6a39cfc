import { createHash } from "node:crypto";
import { describe, expect, it } from "vitest";
import { BlockVersionSchema, CheckRunSchema } from "@/entities";
import { anonymous, type Caller } from "@/lib/auth/caller";
import { archiveBlock, setVisibility } from "@/lib/blocks/archive";
import { createBlock } from "@/lib/blocks/create";
import { forkBlock } from "@/lib/blocks/fork";
import { contextFor } from "@/lib/context";
import { getBlock, getBlockWithLineage, getLineage } from "@/lib/blocks/read";
import { addVersion } from "@/lib/blocks/versions";
import { getEm } from "@/lib/db/orm";
import { decide } from "@/lib/reviews/reviews";
import { makeTeam, rcBlock } from "../support/people";

// The Block JSON read path: one load for block and lineage, and a validator computed from what determines the body.
// RFC 9110 §8.8.3: a strong validator must change whenever the representation data changes; so each change below
// that alters the JSON must alter the ETag, and reads that alter nothing must repeat it.

const etagOf = async (caller: Caller, slug: string, version?: number) =>
  (await getBlockWithLineage(await contextFor(caller), { slug, version })).etag;

describe("block read path", () => {
  it("gives the same view and lineage as getBlock and getLineage, checked against the stored rows", async () => {
    const { team, tag, callers } = await makeTeam(["author", "maintainer"]);
    const slug = `read-${tag}`;
    await createBlock(await contextFor(callers.maintainer), { team: team.slug, text: rcBlock(slug), visibility: "public" });
    const read = await getBlockWithLineage(await contextFor(callers.maintainer), { slug });
    const view = await read.view();
    expect(view).toEqual(await getBlock(await contextFor(callers.maintainer), { slug }));
    expect(read.lineage).toEqual(await getLineage(await contextFor(callers.maintainer), { slug }));
    const em = await getEm();
    const v = await em.findOneOrFail(BlockVersionSchema, { block: { slug }, number: 1 }, { populate: ["author"] });
    expect(view.text).toBe(v.text);
    expect(view.createdAt).toBe(v.createdAt.toISOString());
    expect(view.params.map((p) => p.name)).toEqual(v.params.map((p) => p.name));
    // The content hash names the file: sha256 of its UTF-8 bytes (FIPS 180-4, through Node's crypto).
    expect(view.contentHash).toBe(createHash("sha256").update(v.text, "utf8").digest("hex"));
    expect(view).toMatchObject({ slug, version: 1, headVersion: 1, author: v.author.name, team: team.slug, badge: "pending", approved: false, runStatus: "queued" });
    expect(read.lineage).toEqual({ forkedFrom: null, parentNewerVersions: 0, forks: [] });
    await expect(getBlockWithLineage(await contextFor(callers.author), { slug, version: 7 })).rejects.toMatchObject({ code: "not_found" });
  });

  it("changes the ETag exactly when the JSON changes: run state, approval, forks, parent versions, archive", async () => {
    const { team, tag, callers } = await makeTeam(["author", "maintainer"]);
    const slug = `etag-${tag}`;
    // The author writes it; a maintainer publishes it (DESIGN.md, Roles) and, not being its author, may approve it.
    await createBlock(await contextFor(callers.author), { team: team.slug, text: rcBlock(slug) });
    await setVisibility(await contextFor(callers.maintainer), { slug, visibility: "public" });
    const seen = new Set<string>();
    const fresh = async (why: string) => {
      const e = await etagOf(callers.maintainer, slug, 1);
      expect(seen.has(e), why).toBe(false);
      seen.add(e);
      expect(await etagOf(callers.maintainer, slug, 1), `${why}, read again`).toBe(e);
      return e;
    };
    await fresh("new block");

    const em = await getEm();
    const v1 = await em.findOneOrFail(BlockVersionSchema, { block: { slug }, number: 1 });
    await em.nativeUpdate(CheckRunSchema, { version: v1.id }, { status: "running" });
    await fresh("run started");

    await decide(await contextFor(callers.maintainer), { slug, version: 1, decision: "approved", comment: "" });
    expect((await getBlock(await contextFor(callers.maintainer), { slug, version: 1 })).approved).toBe(true);
    await fresh("approved");

    const fork = await forkBlock(await contextFor(callers.author), { source: slug, slug: `etag-fork-${tag}` });
    await fresh("forked");
    const forkEtag = await etagOf(callers.maintainer, fork.slug);

    await addVersion(await contextFor(callers.author), { slug, params: { R: "4.7 kohm" }, baseVersion: 1, message: "new value" });
    await fresh("a second version moves headVersion");
    expect((await getLineage(await contextFor(callers.maintainer), { slug: fork.slug })).parentNewerVersions).toBe(1);
    expect(await etagOf(callers.maintainer, fork.slug), "the parent gained a version").not.toBe(forkEtag);

    await archiveBlock(await contextFor(callers.maintainer), { slug: fork.slug });
    expect((await getLineage(await contextFor(callers.maintainer), { slug })).forks).toEqual([]);
    await fresh("the fork was archived");
  });

  it("depends on who asks: a team fork of a public block is in the lineage only for its team", async () => {
    const { team, tag, callers } = await makeTeam(["author", "maintainer"]);
    const slug = `who-${tag}`;
    await createBlock(await contextFor(callers.maintainer), { team: team.slug, text: rcBlock(slug), visibility: "public" });
    const before = await etagOf(anonymous, slug);
    await forkBlock(await contextFor(callers.author), { source: slug, slug: `who-fork-${tag}` });
    const member = await getBlockWithLineage(await contextFor(callers.author), { slug });
    const visitor = await getBlockWithLineage(await contextFor(anonymous), { slug });
    expect(member.lineage.forks.map((f) => f.slug)).toEqual([`who-fork-${tag}`]);
    expect(visitor.lineage.forks).toEqual([]);
    expect(visitor.etag, "nothing the visitor sees changed").toBe(before);
    expect(member.etag).not.toBe(visitor.etag);
  });
});
